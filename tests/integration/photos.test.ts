import { createHash, randomBytes, randomUUID } from "node:crypto";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { photos } from "@/db/schema";
import { POST as requestRoute, GET as viewRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/route";
import { POST as completeRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/complete/route";
import { bucket, s3 } from "@/lib/photos/storage";
import { createRecord } from "@/lib/records/write";
import { callRoute, projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
let s: Setup;
let deliveryId: string;

beforeAll(async () => {
  s = await projectWithTeam();
  const p = validBody("placements");
  await createRecord({ user: s.team.superintendent }, "placements", s.project.id, p);
  const d = validBody("deliveries", p.id as string);
  await createRecord({ user: s.team.superintendent }, "deliveries", s.project.id, d);
  deliveryId = d.id as string;
});

function jpeg(size = 50_000) {
  const bytes = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), randomBytes(size - 4)]);
  return { bytes, sha256: createHash("sha256").update(bytes).digest("hex") };
}

const meta = (file: { bytes: Buffer; sha256: string }, extra: Record<string, unknown> = {}) => ({
  recordType: "deliveries",
  recordId: deliveryId,
  caption: "Slump cone, truck 2",
  contentType: "image/jpeg",
  sizeBytes: file.bytes.length,
  sha256: file.sha256,
  ...extra,
});

async function objectsFor(photoId: string) {
  const list = await s3().send(new ListObjectsV2Command({ Bucket: bucket(), Prefix: `projects/${s.project.id}/photos/${photoId}` }));
  return list.Contents ?? [];
}

describe("photo upload through the AWS SDK against the local S3 fake", () => {
  it("presign, PUT, complete → stored; completing twice is one object", async () => {
    const photoId = randomUUID();
    const file = jpeg();
    const params = { projectId: s.project.id, photoId };
    const presign = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(file) });
    expect(presign.status).toBe(200);
    expect(presign.json.key).toBe(`projects/${s.project.id}/photos/${photoId}.jpg`);
    const put = await fetch(presign.json.uploadUrl, { method: "PUT", headers: presign.json.headers, body: file.bytes });
    expect(put.status).toBe(200);
    const done = await callRoute(completeRoute, { user: s.team.superintendent, params });
    expect(done.json).toEqual({ stored: true, photoId });
    const again = await callRoute(completeRoute, { user: s.team.superintendent, params });
    expect(again.json).toEqual({ stored: true, photoId });
    const register = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(file) });
    expect(register.json).toEqual({ stored: true, photoId });
    expect(await objectsFor(photoId)).toHaveLength(1);
    const [row] = await db.select().from(photos).where(eq(photos.id, photoId));
    expect(row.storedAt).not.toBeNull();
    const view = await callRoute(viewRoute, { user: s.team.owner, params });
    const got = await fetch(view.json.url);
    expect(Buffer.from(await got.arrayBuffer()).equals(file.bytes)).toBe(true);
  });

  it("a different hash for the same id is 409; bytes that do not match the declared hash are refused", async () => {
    const photoId = randomUUID();
    const file = jpeg();
    const params = { projectId: s.project.id, photoId };
    const presign = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(file) });
    const other = jpeg();
    const clash = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(other) });
    expect(clash.status).toBe(409);
    // Upload other bytes of the same size under the presigned URL: complete refuses them.
    await fetch(presign.json.uploadUrl, { method: "PUT", headers: presign.json.headers, body: other.bytes });
    const done = await callRoute(completeRoute, { user: s.team.superintendent, params });
    expect(done.status).toBe(409);
    expect(done.json.error.message).toMatch(/fingerprint/);
    const [row] = await db.select().from(photos).where(eq(photos.id, photoId));
    expect(row.storedAt).toBeNull();
  });

  it("oversize or wrong type is 400 with a message; nothing registered", async () => {
    const file = jpeg();
    const big = await callRoute(requestRoute, { user: s.team.superintendent, params: { projectId: s.project.id, photoId: randomUUID() }, body: meta(file, { sizeBytes: 16 * 1024 * 1024 }) });
    expect(big.status).toBe(400);
    expect(big.json.error.fields.sizeBytes).toMatch(/larger than 15 MB/);
    const pdfId = randomUUID();
    const pdf = await callRoute(requestRoute, { user: s.team.superintendent, params: { projectId: s.project.id, photoId: pdfId }, body: meta(file, { contentType: "application/pdf" }) });
    expect(pdf.status).toBe(400);
    expect(pdf.json.error.fields.contentType).toMatch(/Only JPEG, PNG or WebP/);
    expect(await db.select().from(photos).where(eq(photos.id, pdfId))).toHaveLength(0);
  });

  it("another project's member is 403; owners view but do not add", async () => {
    const file = jpeg();
    const params = { projectId: s.project.id, photoId: randomUUID() };
    expect((await callRoute(requestRoute, { user: s.outsider, params, body: meta(file) })).status).toBe(403);
    expect((await callRoute(requestRoute, { user: s.team.owner, params, body: meta(file) })).status).toBe(403);
    expect((await callRoute(completeRoute, { user: s.outsider, params })).status).toBe(403);
  });

  it("completing before the bytes arrived says so", async () => {
    const file = jpeg();
    const params = { projectId: s.project.id, photoId: randomUUID() };
    await callRoute(requestRoute, { user: s.team.inspector, params, body: meta(file) });
    const early = await callRoute(completeRoute, { user: s.team.inspector, params });
    expect(early.status).toBe(409);
    expect(early.json.error.message).toMatch(/not arrived yet/);
  });
});
