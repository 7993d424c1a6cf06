import { projectRoute } from "@/lib/api/project-route";
import { completePhotoUpload } from "@/lib/photos/upload";

export const POST = projectRoute<{ projectId: string; photoId: string }>({ action: "photo.add" }, ({ access, params }) =>
  completePhotoUpload(access, params.photoId),
);
