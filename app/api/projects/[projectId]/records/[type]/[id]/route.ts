import { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { getRecord } from "@/lib/records/read";
import { queryObject, requestContext } from "@/lib/api/request";
import { deleteRecord, updateRecord } from "@/lib/records/write";

type Params = { projectId: string; type: string; id: string };

export const GET = projectRoute<Params>({ action: "project.read" }, ({ req, access, params }) => {
  const { includeDeleted } = queryObject(req);
  return getRecord(requestContext(req, access), params.type, params.projectId, params.id, {
    includeDeleted: includeDeleted === "1" || includeDeleted === "true",
  });
});

// Body { baseVersion, patch }, validated in lib by the record type's own schema.
export const PATCH = projectRoute<Params, unknown>({ action: "project.read", body: z.unknown() }, ({ req, access, params, body }) =>
  updateRecord(requestContext(req, access), params.type, params.projectId, params.id, body),
);

// Body { baseVersion }, or ?baseVersion=N for clients that send no body with DELETE.
export const DELETE = projectRoute<Params, unknown>({ action: "project.read", body: z.unknown() }, ({ req, access, params, body }) => {
  const fromQuery = req.nextUrl.searchParams.get("baseVersion");
  const input = body ?? (fromQuery === null ? {} : { baseVersion: Number(fromQuery) });
  return deleteRecord(requestContext(req, access), params.type, params.projectId, params.id, input);
});
