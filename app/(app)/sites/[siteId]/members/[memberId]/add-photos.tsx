"use client";
// More photos for a member that is already on the register; the page refreshes as each is ready.
import { useRouter } from "next/navigation";
import { useCallback, useRef } from "react";
import { PhotoUploader, type UploadedPhoto } from "@/components/register/photo-uploader";

export function AddPhotos({ memberId }: { memberId: string }) {
  const router = useRouter();
  const seen = useRef(0);
  const onChange = useCallback(
    (ready: UploadedPhoto[]) => {
      if (ready.length > seen.current) router.refresh();
      seen.current = ready.length;
    },
    [router],
  );
  return (
    <div className="mt-3">
      <PhotoUploader presignPath={`/api/v1/members/${memberId}/photos`} onChange={onChange} label="Add photos" />
    </div>
  );
}
