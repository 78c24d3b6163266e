import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { completePhoto } from "@/lib/photos";

/** Confirms an upload: the photo with its thumbnail URL, or 422 with the reason it was refused. */
export const POST = apiHandler<{ photoId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  return { photo: await completePhoto({ user, photoId: params.photoId }) };
});
