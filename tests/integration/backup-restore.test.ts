// Backup → restore (lib/backup): the seeded database with new records and photos is dumped and the
// bucket copied; both are restored into an empty database and an empty bucket; every table's rows
// and every object's bytes must be identical (SHA-256 / md5 per table, [common practice] for
// verifying a restore: compare checksums, not counts).
import { randomUUID, createHash } from "node:crypto";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { CreateBucketCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand } from "@aws-sdk/client-s3";
import { Client } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { createBackup, restoreBackup, verifyBackup } from "@/lib/backup/backup";
import { bucket, s3 } from "@/lib/photos/storage";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { pushMutations } from "@/lib/sync/server/push";
import { projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";

const sourceUrl = process.env.DATABASE_URL!;
const targetName = `placewright_restore_${randomUUID().slice(0, 8)}`;
const targetUrl = sourceUrl.replace(/\/[^/]+$/, `/${targetName}`);
const adminUrl = sourceUrl.replace(/\/[^/]+$/, "/postgres");

async function withClient<T>(url: string, fn: (c: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** md5 of every row of every table (rows as text, sorted), per schema-qualified table. */
async function tableChecksums(url: string): Promise<Record<string, string>> {
  return withClient(url, async (c) => {
    const { rows: tables } = await c.query<{ t: string }>(
      "select format('%I.%I', schemaname, tablename) as t from pg_tables where schemaname not in ('pg_catalog', 'information_schema') order by 1",
    );
    const sums: Record<string, string> = {};
    for (const { t } of tables) {
      const { rows } = await c.query(`select count(*)::int as n, md5(coalesce(string_agg(x::text, E'\\n' order by x::text), '')) as sum from ${t} x`);
      sums[t] = `${rows[0].n}:${rows[0].sum}`;
    }
    return sums;
  });
}

async function objectChecksums(name: string): Promise<Record<string, string>> {
  const sums: Record<string, string> = {};
  let token: string | undefined;
  do {
    const page = await s3().send(new ListObjectsV2Command({ Bucket: name, ContinuationToken: token }));
    for (const o of page.Contents ?? []) {
      const body = await s3().send(new GetObjectCommand({ Bucket: name, Key: o.Key! }));
      sums[o.Key!] = createHash("sha256").update(await body.Body!.transformToByteArray()).digest("hex");
    }
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return sums;
}

afterAll(async () => {
  await withClient(adminUrl, (c) => c.query(`drop database if exists ${targetName} with (force)`));
});

describe("backup and restore", () => {
  it("restores the database and the photo bucket into empty ones with identical checksums", async () => {
    const { project, team } = await projectWithTeam();
    const mutations = [1, 2, 3].map((id) => {
      const body = validBody("placements");
      return { id, name: "create" as const, recordType: "placements" as const, projectId: project.id, recordId: body.id as string, args: body };
    });
    await pushMutations(team.superintendent, { clientId: randomUUID(), schemaVersion: SYNC_SCHEMA_VERSION, mutations });
    for (const n of [1, 2]) {
      const bytes = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff]), Buffer.from(randomUUID().repeat(50 * n))]);
      await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: `projects/${project.id}/photos/${randomUUID()}.jpg`, Body: bytes, ContentType: "image/jpeg" }));
    }

    const dir = await mkdtemp(path.join(tmpdir(), "placewright-backup-"));
    const manifest = await createBackup({ databaseUrl: sourceUrl, s3: s3(), bucket: bucket(), outDir: dir });
    const sourceTables = await tableChecksums(sourceUrl);
    const sourceObjects = await objectChecksums(bucket());
    expect(manifest.objects.length).toBe(Object.keys(sourceObjects).length);
    expect(Object.keys(sourceObjects).length).toBeGreaterThanOrEqual(2);
    for (const o of manifest.objects) expect(o.sha256).toBe(sourceObjects[o.key]);

    const targetBucket = `restore-${randomUUID().slice(0, 8)}`;
    await s3().send(new CreateBucketCommand({ Bucket: targetBucket }));
    await withClient(adminUrl, (c) => c.query(`create database ${targetName}`));
    await restoreBackup({ databaseUrl: targetUrl, s3: s3(), bucket: targetBucket, fromDir: dir });

    const targetTables = await tableChecksums(targetUrl);
    expect(Object.keys(targetTables).length).toBeGreaterThan(20);
    expect(targetTables["public.placements"]).toBe(sourceTables["public.placements"]);
    expect(targetTables).toEqual(sourceTables);
    expect(await objectChecksums(targetBucket)).toEqual(sourceObjects);

    // A second restore into the now non-empty targets is refused, changing nothing.
    await expect(restoreBackup({ databaseUrl: targetUrl, s3: s3(), bucket: targetBucket, fromDir: dir })).rejects.toThrow(/not empty/);
    expect(await tableChecksums(targetUrl)).toEqual(sourceTables);

    // A damaged file is caught by the manifest before anything is restored.
    const victim = path.join(dir, manifest.objects[0].file);
    const bytes = await readFile(victim);
    bytes[bytes.length - 1] ^= 0xff;
    await writeFile(victim, bytes);
    await expect(verifyBackup(dir)).rejects.toThrow(/does not match its checksum/);
    await rm(dir, { recursive: true, force: true });
  }, 120_000);
});
