import { apiRoute } from "@/lib/api/handler";
import { completePhotoUpload } from "@/lib/photos/upload";

export const POST = apiRoute<{ projectId: string; photoId: string }>({}, ({ user, params }) =>
  completePhotoUpload(user, params.projectId, params.photoId),
);
