import { siteRoute } from "@/lib/api/route";
import { completePhoto } from "@/lib/photos";

/** Confirms an upload: the photo with its thumbnail URL, or 422 with the reason it was refused. */
export const POST = siteRoute({ resource: "photo", permission: "logMember" }, async ({ user, resource: photo }) => ({
  photo: await completePhoto({ user, photo }),
}));
