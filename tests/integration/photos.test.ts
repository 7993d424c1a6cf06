import { createHash, randomBytes, randomUUID } from "node:crypto";
import { HeadObjectCommand, ListObjectsV2Command } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { photos } from "@/db/schema";
import { POST as requestRoute, GET as viewRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/route";
import { POST as completeRoute } from "@/app/api/projects/[projectId]/photos/[photoId]/complete/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as pullRoute } from "@/app/api/sync/pull/route";
import { PHOTO_SIGNED_MESSAGE } from "@/lib/photos/rules";
import { bucket, s3 } from "@/lib/photos/storage";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { transitionPlacement } from "@/lib/placements/transition";
import { accessTo } from "@/lib/auth/access";
import { addAmendment } from "@/lib/signoff/sign-off";
import { createRecord, deleteRecord } from "@/lib/records/write";
import { SYNC_SCHEMA_VERSION, type Mutation, type PullResponse } from "@/lib/sync/protocol";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
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
    // A short-lived link: SigV4 query presigning carries its lifetime in X-Amz-Expires (AWS SigV4 docs).
    expect(Number(new URL(view.json.url).searchParams.get("X-Amz-Expires"))).toBeLessThanOrEqual(15 * 60);
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

  it("another project's member is 404 (not a member); owners view but do not add (403)", async () => {
    const file = jpeg();
    const params = { projectId: s.project.id, photoId: randomUUID() };
    expect((await callRoute(requestRoute, { user: s.outsider, params, body: meta(file) })).status).toBe(404);
    expect((await callRoute(requestRoute, { user: s.team.owner, params, body: meta(file) })).status).toBe(403);
    expect((await callRoute(completeRoute, { user: s.outsider, params })).status).toBe(404);
    expect((await callRoute(viewRoute, { user: s.outsider, params })).status).toBe(404);
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

// The photo's metadata travels through the normal outbox (SYNC.md "Photos"): created at once on the
// device, pulled by the other devices with storedAt null (they show a placeholder), then the bytes.
describe("photos through sync", () => {
  let seq = 0;
  const push = (user: TestUser, clientId: string, mutations: Mutation[]) =>
    callRoute(pushRoute, { user, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations } });
  const pull = async (user: TestUser, clientId: string, cursor: PullResponse["cursor"] | null = null) =>
    (await callRoute(pullRoute, { user, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor } })).json as PullResponse;
  const photoOf = (res: PullResponse, id: string) => res.changes.find((c) => c.recordType === "photos" && c.record.id === id)?.record;
  const createPhoto = (id: number, photoId: string, file: { bytes: Buffer; sha256: string }, extra: Record<string, unknown> = {}): Mutation => ({
    id,
    name: "create",
    recordType: "photos",
    projectId: s.project.id,
    recordId: photoId,
    args: { id: photoId, ...meta(file), takenAt: "2026-11-16T08:40:00-06:00", ...extra },
  });

  it("a photo created by a push is pulled by another device as not stored; presign, PUT, complete; the next pull shows it stored", async () => {
    const device = randomUUID();
    const photoId = randomUUID();
    const file = jpeg(80_000);
    // The device sends a storage key and a stored time of its own: both are the server's to set.
    const pushed = await push(s.team.superintendent, device, [createPhoto(++seq, photoId, file, { storageKey: "elsewhere/x.jpg", storedAt: "2026-11-16T09:00:00Z" })]);
    expect(pushed.json.results[0]).toMatchObject({ result: "applied", version: 1 });

    const office = randomUUID();
    const first = await pull(s.team.office, office);
    const seen = photoOf(first, photoId);
    expect(seen).toMatchObject({ recordType: "deliveries", recordId: deliveryId, sha256: file.sha256, sizeBytes: file.bytes.length, storedAt: null });
    expect(seen?.storageKey).toBe(`projects/${s.project.id}/photos/${photoId}.jpg`);

    // The upload lane: registration finds the synced photo (same hash: no new row), presigns the key.
    const params = { projectId: s.project.id, photoId };
    const presign = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(file) });
    expect(presign.status).toBe(200);
    expect(presign.json.key).toBe(seen?.storageKey);
    expect((await fetch(presign.json.uploadUrl, { method: "PUT", headers: presign.json.headers, body: file.bytes })).status).toBe(200);
    expect((await callRoute(completeRoute, { user: s.team.superintendent, params })).json).toEqual({ stored: true, photoId });

    const next = await pull(s.team.office, office, first.cursor);
    const stored = photoOf(next, photoId);
    expect(stored?.storedAt).not.toBeNull();
    expect(stored?.version).toBe(2);
    // Stored under the server's own key (the upload key's PUT link cannot reach it).
    expect(stored?.storageKey).toBe(`projects/${s.project.id}/photos/${photoId}/${file.sha256}.jpg`);
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: String(stored?.storageKey) }));
    expect(head.ContentLength).toBe(file.bytes.length);

    // The same create again (a lost answer) is applied once; registering another hash is a 409.
    const replay = await push(s.team.superintendent, randomUUID(), [createPhoto(1, photoId, file)]);
    expect(replay.json.results[0].result).toBe("applied");
    const other = await callRoute(requestRoute, { user: s.team.superintendent, params, body: meta(jpeg(80_000)) });
    expect(other.status).toBe(409);
    expect((await db.select().from(photos).where(eq(photos.id, photoId)))).toHaveLength(1);
  });

  it("a pushed photo of another type or over 15 MB is refused with the message; an owner's push is refused as forbidden", async () => {
    const file = jpeg();
    const device = randomUUID();
    const gif = randomUUID();
    const big = randomUUID();
    const res = await push(s.team.superintendent, device, [
      createPhoto(1, gif, file, { contentType: "image/gif" }),
      createPhoto(2, big, file, { sizeBytes: 16 * 1024 * 1024 }),
    ]);
    expect(res.json.results[0]).toMatchObject({ result: "rejected", reason: "invalid" });
    expect(res.json.results[0].message).toMatch(/Only JPEG, PNG or WebP/);
    expect(res.json.results[1].message).toMatch(/larger than 15 MB/);
    const owner = await push(s.team.owner, randomUUID(), [createPhoto(1, randomUUID(), file)]);
    expect(owner.json.results[0]).toMatchObject({ result: "rejected", reason: "forbidden" });
    expect(await db.select().from(photos).where(eq(photos.id, gif))).toHaveLength(0);
  });

  it("a photo must belong to a record of the same project that exists", async () => {
    const res = await push(s.team.superintendent, randomUUID(), [createPhoto(1, randomUUID(), jpeg(), { recordId: randomUUID() })]);
    expect(res.json.results[0]).toMatchObject({ result: "rejected", reason: "invalid" });
    expect(res.json.results[0].message).toMatch(/no delivery with this id/);
  });

  it("deleting the record tombstones its photos", async () => {
    const p = validBody("placements");
    await createRecord({ user: s.team.superintendent }, "placements", s.project.id, p);
    const d = validBody("deliveries", p.id as string);
    await createRecord({ user: s.team.superintendent }, "deliveries", s.project.id, d);
    const photoId = randomUUID();
    await push(s.team.superintendent, randomUUID(), [createPhoto(1, photoId, jpeg(), { recordId: d.id })]);
    await deleteRecord({ user: s.team.superintendent }, "deliveries", s.project.id, d.id as string, { baseVersion: 1 });
    const [row] = await db.select().from(photos).where(eq(photos.id, photoId));
    expect(row.deletedAt).not.toBeNull();
  });

  it("a signed placement takes no new photo, on it or its records, by push or registration; an amendment does", async () => {
    const team = s.team;
    const p = validBody("placements");
    await createRecord({ user: team.superintendent }, "placements", s.project.id, p);
    const d = validBody("deliveries", p.id as string);
    await createRecord({ user: team.superintendent }, "deliveries", s.project.id, d);
    let version = 1;
    for (const [role, to] of [["superintendent", "ready"], ["inspector", "cleared"], ["superintendent", "placing"], ["superintendent", "placed"]] as const) {
      await transitionPlacement({ user: team[role] }, s.project.id, p.id as string, { to, baseVersion: version++ });
    }
    await markPlacementSigned({ user: team.inspector }, s.project.id, p.id as string, { baseVersion: version });

    const file = jpeg();
    const late = randomUUID();
    const res = await push(team.superintendent, randomUUID(), [
      createPhoto(1, late, file, { recordId: d.id }),
      createPhoto(2, randomUUID(), file, { recordType: "placements", recordId: p.id }),
    ]);
    for (const r of res.json.results) expect(r).toMatchObject({ result: "rejected", reason: "signed", message: PHOTO_SIGNED_MESSAGE });
    const direct = await callRoute(requestRoute, { user: team.superintendent, params: { projectId: s.project.id, photoId: late }, body: meta(file, { recordId: d.id }) });
    expect(direct.status).toBe(409);
    expect(direct.json.error.message).toBe(PHOTO_SIGNED_MESSAGE);
    expect(await db.select().from(photos).where(eq(photos.id, late))).toHaveLength(0);

    const amendment = await addAmendment(await accessTo(team.inspector, s.project.id), p.id as string, { id: randomUUID(), what: "Truck 3 ticket photo added", why: "Ticket found in the cab" });
    const photoId = randomUUID();
    const ok = await push(team.inspector, randomUUID(), [createPhoto(1, photoId, file, { recordType: "amendments", recordId: amendment.id })]);
    expect(ok.json.results[0]).toMatchObject({ result: "applied" });
  });
});
