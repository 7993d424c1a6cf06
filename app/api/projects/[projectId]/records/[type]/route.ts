import { NextResponse } from "next/server";
import { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { listRecords } from "@/lib/records/read";
import { queryObject, requestContext } from "@/lib/api/request";
import { createRecord } from "@/lib/records/write";

type Params = { projectId: string; type: string };

export const GET = projectRoute<Params>({ action: "project.read" }, ({ req, access, params }) =>
  listRecords(requestContext(req, access), params.type, params.projectId, queryObject(req)),
);

// The body is validated in lib by the record type's own schema.
export const POST = projectRoute<Params, unknown>({ action: "project.read", body: z.unknown() }, async ({ req, access, params, body }) => {
  const { record, created } = await createRecord(requestContext(req, access), params.type, params.projectId, body);
  return NextResponse.json(record, { status: created ? 201 : 200 });
});
