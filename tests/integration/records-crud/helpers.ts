// Every record type through its routes: create, read, update, delete, list with filters; versions,
// change numbers and the audit entry of every accepted write (in the same transaction).
import { asc, eq, getTableName } from "drizzle-orm";
import { beforeAll } from "vitest";
import { db } from "@/db";
import { auditEntries } from "@/db/schema";
import { getRecordDef } from "@/lib/records/registry";
import { projectWithTeam } from "../helpers";
import { type Team } from "../record-fixtures";

export type Setup = Awaited<ReturnType<typeof projectWithTeam>>;

export async function auditOf(recordId: string) {
  return db.select().from(auditEntries).where(eq(auditEntries.recordId, recordId)).orderBy(asc(auditEntries.id));
}

export const tableName = (type: string) => getTableName(getRecordDef(type).table);

export let s: Setup;
export let team: Team;
/** One project with its team for the calling file's tests (`s`, `team`), made once before them. */
export function setUpProjectWithTeam() {
  beforeAll(async () => {
    s = await projectWithTeam();
    team = s.team;
  });
}
