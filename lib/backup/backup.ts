// `npm run backup` / `npm run restore`: a PostgreSQL dump and a copy of the photo bucket, with a
// manifest of SHA-256 checksums. The dump is taken first: photo objects are written before the
// database marks them stored and are never rewritten, so every photo the dump calls stored is in
// the bucket copy taken after it.
import { createHash } from "node:crypto";
import { mkdir, readFile, stat, writeFile } from "node:fs/promises";
import path from "node:path";
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, type S3Client } from "@aws-sdk/client-s3";
import { Client } from "pg";
import { dumpDatabase, restoreDatabase } from "./pg-tools";

export type ManifestObject = { key: string; file: string; bytes: number; sha256: string; contentType: string };
export type Manifest = {
  format: "placewright-backup-1";
  createdAt: string;
  database: { file: string; bytes: number; sha256: string };
  bucket: string;
  objects: ManifestObject[];
};

const sha256 = (bytes: Buffer | Uint8Array) => createHash("sha256").update(bytes).digest("hex");

async function listKeys(s3: S3Client, bucket: string): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys;
}

export async function createBackup(opts: { databaseUrl: string; s3: S3Client; bucket: string; outDir: string }): Promise<Manifest> {
  await mkdir(path.join(opts.outDir, "objects"), { recursive: true });
  const dumpFile = path.join(opts.outDir, "database.dump");
  await dumpDatabase(opts.databaseUrl, dumpFile);
  const dump = await readFile(dumpFile);
  const objects: ManifestObject[] = [];
  for (const [i, key] of (await listKeys(opts.s3, opts.bucket)).entries()) {
    const res = await opts.s3.send(new GetObjectCommand({ Bucket: opts.bucket, Key: key }));
    const bytes = Buffer.from(await res.Body!.transformToByteArray());
    // Keys may hold slashes; files are numbered so any key maps to a safe name.
    const file = `objects/${String(i).padStart(6, "0")}`;
    await writeFile(path.join(opts.outDir, file), bytes);
    objects.push({ key, file, bytes: bytes.length, sha256: sha256(bytes), contentType: res.ContentType ?? "application/octet-stream" });
  }
  const manifest: Manifest = {
    format: "placewright-backup-1",
    createdAt: new Date().toISOString(),
    database: { file: "database.dump", bytes: (await stat(dumpFile)).size, sha256: sha256(dump) },
    bucket: opts.bucket,
    objects,
  };
  await writeFile(path.join(opts.outDir, "manifest.json"), JSON.stringify(manifest, null, 2));
  return manifest;
}

/** Reads the manifest and checks every file against it; throws naming the first damaged file. */
export async function verifyBackup(dir: string): Promise<Manifest> {
  const manifest = JSON.parse(await readFile(path.join(dir, "manifest.json"), "utf8")) as Manifest;
  if (manifest.format !== "placewright-backup-1") throw new Error(`${dir} is not a Placewright backup (unknown manifest format).`);
  for (const f of [manifest.database, ...manifest.objects]) {
    if (sha256(await readFile(path.join(dir, f.file))) !== f.sha256) throw new Error(`Backup file ${f.file} does not match its checksum: the backup is damaged.`);
  }
  return manifest;
}

async function assertEmptyDatabase(databaseUrl: string): Promise<void> {
  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const { rows } = await client.query(
      "select count(*)::int as n from pg_tables where schemaname not in ('pg_catalog', 'information_schema')",
    );
    if (rows[0].n > 0) throw new Error("The target database is not empty. Restore into a new, empty database.");
  } finally {
    await client.end();
  }
}

export async function restoreBackup(opts: { databaseUrl: string; s3: S3Client; bucket: string; fromDir: string }): Promise<Manifest> {
  const manifest = await verifyBackup(opts.fromDir);
  await assertEmptyDatabase(opts.databaseUrl);
  if ((await listKeys(opts.s3, opts.bucket)).length > 0) throw new Error(`The target bucket ${opts.bucket} is not empty. Restore into an empty bucket.`);
  await restoreDatabase(opts.databaseUrl, path.join(opts.fromDir, manifest.database.file));
  for (const o of manifest.objects) {
    const body = await readFile(path.join(opts.fromDir, o.file));
    await opts.s3.send(new PutObjectCommand({ Bucket: opts.bucket, Key: o.key, Body: body, ContentType: o.contentType }));
  }
  return manifest;
}
