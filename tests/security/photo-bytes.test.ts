// Finding 9: a photo's bytes could change after "complete" (even after sign-off) while its
// presigned PUT was still valid, and "complete" took any bytes whose hash matched, whatever they
// were. The attacks, against the local S3 fake through the real SDK and real route handlers:
// 1. upload a photo, complete it, then PUT other bytes through the same (still valid) link;
// 2. register an HTML page as image/jpeg with its true size and hash, and complete it.
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as viewRoute, POST as requestRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/route";
import { POST as completeRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/complete/route";
import { db } from "@/db";
import { photos } from "@/db/schema";
import { callRoute, projectWithTeam } from "../integration/helpers";
import { makeRecord } from "../integration/record-fixtures";

let s: Awaited<ReturnType<typeof projectWithTeam>>;
let deliveryId: string;
const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");

beforeAll(async () => {
  s = await projectWithTeam();
  deliveryId = (await makeRecord("deliveries", s.project.id, s.team)).id;
});

async function register(bytes: Buffer, contentType = "image/jpeg") {
  const photoId = randomUUID();
  const params = { projectId: s.project.id, photoId };
  const body = { recordType: "deliveries", recordId: deliveryId, caption: "Truck ticket 4471", contentType, sizeBytes: bytes.length, sha256: sha(bytes) };
  const presign = await callRoute(requestRoute, { user: s.team.superintendent, params, body });
  expect(presign.status, JSON.stringify(presign.json)).toBe(200);
  return { params, photoId, presign: presign.json };
}

async function viewBytes(params: { projectId: string; photoId: string }) {
  const view = await callRoute(viewRoute, { user: s.team.owner, params });
  expect(view.status).toBe(200);
  return Buffer.from(await (await fetch(view.json.url)).arrayBuffer());
}

describe("photo bytes after complete (finding 9)", () => {
  it("a still-valid presigned PUT after complete does not change the stored photo", async () => {
    const original = await sharp({ create: { width: 64, height: 48, channels: 3, background: "#6b7280" } }).jpeg().toBuffer();
    const { params, photoId, presign } = await register(original);
    expect((await fetch(presign.uploadUrl, { method: "PUT", headers: presign.headers, body: original })).status).toBe(200);
    expect((await callRoute(completeRoute, { user: s.team.superintendent, params })).json).toEqual({ stored: true, photoId });
    const [before] = await db.select().from(photos).where(eq(photos.id, photoId));

    // The attack: the same link, other bytes of the same size and type, inside its 15 minutes.
    const forged = Buffer.concat([original.subarray(0, 4), randomBytes(original.length - 4)]);
    const put = await fetch(presign.uploadUrl, { method: "PUT", headers: presign.headers, body: forged });
    expect(put.status).toBe(200); // the storage service accepts it: the link is valid

    const served = await viewBytes(params);
    expect(sha(served)).toBe(sha(original));
    expect(served.equals(forged)).toBe(false);
    const [after] = await db.select().from(photos).where(eq(photos.id, photoId));
    expect(after).toEqual(before); // the row did not change either
    expect(after.storageKey).not.toBe(presign.key); // the served key is not one a device was given
  });

  it("bytes that are not the declared image type are refused on complete, with a message; nothing is stored", async () => {
    const html = Buffer.from(`<html><body><script>document.title="x"</script>${"a".repeat(200)}</body></html>`);
    const { params, photoId, presign } = await register(html);
    expect((await fetch(presign.uploadUrl, { method: "PUT", headers: presign.headers, body: html })).status).toBe(200);
    const done = await callRoute(completeRoute, { user: s.team.superintendent, params });
    expect(done.status).toBe(409);
    expect(done.json.error.message).toMatch(/not a JPEG image/);
    const [row] = await db.select().from(photos).where(eq(photos.id, photoId));
    expect(row.storedAt).toBeNull();
    expect((await callRoute(viewRoute, { user: s.team.owner, params })).json).toEqual({ stored: false });
  });
});
