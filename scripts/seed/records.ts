// Seeds a few weeks of the demo scenario's records (scripts/seed/records-data.ts) through the same
// rules as the app: every row passes its record schema, computed fields come from lib/concrete,
// and every insert or sign-off takes the project's next change number. Idempotent: fixed ids, and
// rows that exist are left alone (they may have been edited since, or frozen by a sign-off).
import { and, eq, inArray } from "drizzle-orm";
import { parseOrThrow } from "@/lib/validation";
import { refreshProject } from "@/lib/findings/store";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { getRecordDef, type RecordType } from "@/lib/records/registry";
import type { Database, Transaction } from "@/db";
import { placements, projects } from "@/db/schema";
import type { DemoRecord } from "./ids";
import { demoRecords } from "./records-data";

async function insertMissing(tx: Transaction, type: RecordType, rows: DemoRecord[]): Promise<void> {
  if (rows.length === 0) return;
  const def = getRecordDef(type);
  const existing = await tx
    .select({ id: def.table.id })
    .from(def.table)
    .where(inArray(def.table.id, rows.map((r) => r.values.id as string)));
  const have = new Set(existing.map((r) => r.id as string));
  for (const row of rows.filter((r) => !have.has(r.values.id as string))) {
    const values = parseOrThrow(def.create, row.values);
    const [project] = await tx.select({ unitSystem: projects.unitSystem }).from(projects).where(eq(projects.id, row.projectId));
    const derived = def.compute?.(values, { unitSystem: project.unitSystem }) ?? {};
    const changeSeq = await nextChangeSeq(tx, row.projectId);
    await tx.insert(def.table).values({
      ...values,
      ...derived,
      ...row.extra,
      projectId: row.projectId,
      version: 1,
      changeSeq,
      createdAt: row.recordedAt,
      updatedAt: row.recordedAt,
      updatedBy: row.by,
    } as never);
  }
}

/** Signs the placements the scenario has signed, once: placed → signed is the one change a signed row allows. */
async function signPlacements(tx: Transaction, signed: DemoRecord[]): Promise<void> {
  for (const p of signed) {
    const [row] = await tx.select().from(placements).where(eq(placements.id, p.values.id as string)).for("update");
    if (!row || row.state !== "placed") continue;
    const changeSeq = await nextChangeSeq(tx, row.projectId);
    await tx
      .update(placements)
      .set({
        state: "signed",
        signedAt: p.signedAt!,
        signedBy: p.signedBy!,
        version: row.version + 1,
        changeSeq,
        updatedAt: p.signedAt!,
        updatedBy: p.signedBy!,
      })
      .where(and(eq(placements.id, row.id), eq(placements.state, "placed")));
  }
}

export async function seedRecords(db: Database): Promise<void> {
  await db.transaction(async (tx) => {
    // Parents before children; signed placements are inserted as placed and signed at the end,
    // because the database refuses new records under a signed placement.
    const records = demoRecords();
    for (const [type, rows] of records) await insertMissing(tx, type, rows);
    const toSign = records.find(([type]) => type === "placements")![1].filter((p) => p.signedAt);
    await signPlacements(tx, toSign);
    // The rows went in below the write path: judge every day of the demo with the rulebook once.
    for (const projectId of new Set(records.flatMap(([, rows]) => rows.map((r) => r.projectId)))) await refreshProject(tx, projectId);
  });
}
