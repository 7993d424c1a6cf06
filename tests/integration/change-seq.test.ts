// Regression test for the pull-cursor race (SYNC.md "Change sequence"): a change number taken by a
// slow transaction must not be overtaken by a later one that commits first, or a reader paging
// with changeSeq > cursor would move past the slow row and never see it.
import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { createRecord } from "@/lib/records/write";
import { projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function visibleMaxSeq(projectId: string): Promise<number> {
  const { rows } = await db.execute(sql`select coalesce(max(change_seq), 0) as n from mix_designs where project_id = ${projectId}`);
  return Number((rows[0] as { n: string }).n);
}

describe("change sequence", () => {
  it("numbers become visible in commit order: a second writer waits for the first to commit", async () => {
    const { project, team } = await projectWithTeam();
    const first = await createRecord({ user: team.office }, "mix-designs", project.id, validBody("mix-designs"));
    const cursor = first.record.changeSeq; // a device has pulled up to here

    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let slowSeq = 0;
    const slow = db.transaction(async (tx) => {
      const { record } = await createRecord({ user: team.office, tx }, "mix-designs", project.id, validBody("mix-designs"));
      slowSeq = record.changeSeq;
      await gate; // still open: its row is not visible yet
    });
    while (!slowSeq) await sleep(5);

    let fastDone = false;
    const fast = createRecord({ user: team.office }, "mix-designs", project.id, validBody("mix-designs")).then((r) => {
      fastDone = true;
      return r;
    });
    await sleep(150);
    expect(fastDone).toBe(false); // waiting on the counter row
    expect(await visibleMaxSeq(project.id)).toBe(cursor); // nothing beyond the cursor has committed

    release();
    await slow;
    const { record: later } = await fast;
    expect(slowSeq).toBe(cursor + 1);
    expect(later.changeSeq).toBe(cursor + 2);
    // A reader that pulls now sees both rows after its cursor, in number order.
    const { rows } = await db.execute(
      sql`select change_seq from mix_designs where project_id = ${project.id} and change_seq > ${cursor} order by change_seq`,
    );
    expect(rows.map((r) => Number((r as { change_seq: string }).change_seq))).toEqual([cursor + 1, cursor + 2]);
  });

  it("projects count independently", async () => {
    const a = await projectWithTeam();
    const b = await projectWithTeam();
    const ra = await createRecord({ user: a.team.office }, "mix-designs", a.project.id, validBody("mix-designs"));
    const rb = await createRecord({ user: b.team.office }, "mix-designs", b.project.id, validBody("mix-designs"));
    expect(ra.record.changeSeq).toBe(1);
    expect(rb.record.changeSeq).toBe(1);
  });
});
