import { projectRoute } from "@/lib/api/project-route";
import { photoViewUrl, photoUploadSchema, requestPhotoUpload, type PhotoUploadInput } from "@/lib/photos/upload";

type Params = { projectId: string; photoId: string };

/** A short-lived link to the stored photo. */
export const GET = projectRoute<Params>({ action: "project.read" }, ({ access, params }) => photoViewUrl(access, params.photoId));

/** Register the photo and get a presigned PUT for its bytes. */
export const POST = projectRoute<Params, PhotoUploadInput>({ action: "photo.add", body: photoUploadSchema }, ({ access, params, body }) =>
  requestPhotoUpload(access, params.photoId, body),
);
