// npm run restore -- --from <folder>: checks the backup against its manifest, then restores it into
// the EMPTY database DATABASE_URL (run scripts/migrate.mts afterwards only for a newer app version)
// and the EMPTY bucket S3_BUCKET. Refuses a non-empty target rather than mixing two histories.
import { parseArgs } from "node:util";
import { restoreBackup } from "../lib/backup/backup.ts";
import { bucket, s3 } from "../lib/photos/storage.ts";

const { values } = parseArgs({ options: { from: { type: "string" } } });
const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error("DATABASE_URL is not set: it names the empty database to restore into.");
if (!values.from) throw new Error("Name the backup folder: npm run restore -- --from .data/backups/<time>");
try {
  const manifest = await restoreBackup({ databaseUrl, s3: s3(), bucket: bucket(), fromDir: values.from });
  console.log(`restored ${values.from}: database and ${manifest.objects.length} photo objects`);
} catch (error) {
  console.error((error as Error).message);
  process.exitCode = 1;
}
