// npm run backup [-- --out <folder>]: dump DATABASE_URL and copy the S3_BUCKET photos, with a
// manifest of SHA-256 checksums (lib/backup/backup.ts). Default folder: .data/backups/<time>.
import { parseArgs } from "node:util";
import { createBackup } from "../lib/backup/backup.ts";
import { bucket, s3 } from "../lib/photos/storage.ts";

const { values } = parseArgs({ options: { out: { type: "string" } } });
const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error("DATABASE_URL is not set: it names the database to back up.");
const outDir = values.out ?? `.data/backups/${new Date().toISOString().replace(/[:.]/g, "-")}`;
const manifest = await createBackup({ databaseUrl, s3: s3(), bucket: bucket(), outDir });
console.log(`backup written to ${outDir}: database ${manifest.database.bytes} bytes, ${manifest.objects.length} photo objects`);
