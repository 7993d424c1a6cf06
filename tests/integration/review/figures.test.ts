// The review list's figures agree with the rulebook (lib/checks over the day's records, lib/findings).
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { attention } from "@/lib/checks";
import { dayFindings, loadCheckDay, loadProject } from "@/lib/findings/load";
import { refreshProject } from "@/lib/findings/store";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { addMembership, createProject } from "../helpers";
import { office, nextSeq, insertMix, insertRow, list, setUpReviewData } from "./fixtures";

setUpReviewData({ bulk: false });

describe("figures agree with the digest's rules", () => {
  // One placement per day, so the digest's warnings for that day are the placement's own.
  type Case = { placementId: string; date: string; projectId: string };
  const cases: Case[] = [];
  let si: { id: string };
  let ip: { id: string };

  beforeAll(async () => {
    si = await createProject({ unitSystem: "SI" });
    ip = await createProject({ unitSystem: "IP" });
    await db.execute(sql`update projects set revolution_limit = 300 where id = ${si.id}::uuid`);
    await db.execute(sql`update projects set evaporation_high_kg_m2_h = 0.8 where id = ${ip.id}::uuid`);
    await addMembership(office.id, si.id, "office");
    await addMembership(office.id, ip.id, "office");
    let rnd = 12345;
    const rand = () => ((rnd = (rnd * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const pickOne = <T,>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)];
    for (const [k, project] of [si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip].entries()) {
      const target = pickOne([40, 50, 75, 100, 101.6, 125, 150, 200]);
      const mix = await insertMix(project.id, {
        slump_target_mm: pickOne([target, target, null]),
        slump_type: pickOne(["target", "maximum"]),
        slump_tolerance_mm: pickOne([null, null, 20]),
        air_target_pct: pickOne([null, 6, 5.5]),
        air_tolerance_pct: pickOne([null, null, 1]),
        max_concrete_temp_c: pickOne([null, 32]),
        low_bleed: rand() < 0.3,
      });
      const date = new Date(Date.UTC(2027, 2, 1 + k)).toISOString().slice(0, 10);
      const start = Date.parse(`${date}T10:00:00-06:00`);
      const at = (min: number) => new Date(start + min * 60_000).toISOString();
      const placementId = randomUUID();
      await insertRow("placements", { id: placementId, project_id: project.id, change_seq: nextSeq(), element: `Case ${k}`, element_type: "wall", planned_start: at(0), mix_id: mix, state: "placing" });
      for (let t = 0; t < 4; t++) {
        const deliveryId = randomUUID();
        const finish = pickOne([null, 60, 90, 90.5, 120, -5]);
        await insertRow("deliveries", {
          id: deliveryId, project_id: project.id, change_seq: nextSeq(), placement_id: placementId, ticket_number: `${k}-${t}`, volume_m3: 7,
          batched_at: at(t * 20), arrived_at: at(t * 20 + 25), discharge_finished_at: finish === null ? null : at(t * 20 + finish),
          revolutions: pickOne([null, 250, 300, 301]), water_added_l: pickOne([null, 0, 20, 60]), status: rand() < 0.2 ? "rejected" : "accepted",
        });
        const slumpBase = target;
        await insertRow("field_tests", {
          id: randomUUID(), project_id: project.id, change_seq: nextSeq(), placement_id: placementId, delivery_id: deliveryId, sampled_at: at(t * 20 + 30),
          slump_mm: pickOne([null, slumpBase, slumpBase + pickOne([-66, -65, -41, -40, -25.4, -25, -15.1, -15, -12.7, 12.7, 15, 15.1, 25, 25.4, 26, 38.1, 40, 41])]),
          air_pct: pickOne([null, 4, 4.5, 7.5, 7.6, 6]),
          concrete_temp_c: pickOne([null, 30, 32, 32.5, 35, 35.5]),
        });
        await insertRow("weather_observations", {
          id: randomUUID(), project_id: project.id, change_seq: nextSeq(), placement_id: placementId, observed_at: at(t * 20 + 5),
          air_temp_c: 25, relative_humidity_pct: pickOne([20, 45, 60, 75, 90]), wind_kmh: pickOne([5, 10, 20]), concrete_temp_c: pickOne([null, 22, 28]),
        });
      }
      cases.push({ placementId, date, projectId: project.id });
    }
    await refreshProject(db, si.id);
    await refreshProject(db, ip.id);
  }, 120_000);

  it("late trucks, revolutions, water, tests out of tolerance, evaporation and 'has warnings' are the rulebook's", async () => {
    const res = await list(office, { projects: `${si.id},${ip.id}`, pageSize: "200" });
    expect(res.status).toBe(200);
    const rows = new Map((res.json.rows as PlacementReviewRow[]).map((r) => [r.id, r]));
    expect(rows.size).toBe(cases.length);
    let warned = 0;
    const risks = new Set<string | null>();
    for (const c of cases) {
      const input = await loadCheckDay(db, await loadProject(db, c.projectId), c.date);
      const all = dayFindings(input, c.date);
      const w = attention(all).filter((f) => f.placementId === c.placementId || f.subject.type === "day");
      const subjects = (pick: (f: (typeof w)[number]) => boolean) => new Set(w.filter(pick).map((f) => f.subject.id)).size;
      const row = rows.get(c.placementId)!;
      const label = `${row.element} (${row.unitSystem})`;
      expect(row.lateTrucks, label).toBe(subjects((f) => f.rule === "discharge-time"));
      expect(row.revolutionsOver, label).toBe(subjects((f) => f.rule === "revolutions"));
      expect(row.waterLoads, label).toBe(subjects((f) => f.rule === "site-water"));
      expect(row.testsOut, label).toBe(subjects((f) => f.subject.type === "field-test"));
      const evaporation = all.filter((f) => f.rule === "evaporation" && f.placementId === c.placementId).map((f) => f.severity);
      const worst = evaporation.includes("warning") ? "high" : evaporation.includes("caution") ? "caution" : "low";
      expect(row.evaporationRisk, label).toBe(worst);
      risks.add(row.evaporationRisk);
      expect(row.hasWarnings, label).toBe(w.length > 0);
      if (row.hasWarnings) warned++;
      const day = { deliveries: input.deliveries.filter((d) => d.placementId === c.placementId) };
      const accepted = day.deliveries.filter((d) => d.status === "accepted");
      expect(row.placedM3).toBeCloseTo(accepted.reduce((s, d) => s + d.volumeM3, 0), 9);
      expect(row.trucks).toBe(day.deliveries.length);
    }
    // The random cases cover both outcomes and every evaporation level.
    expect(warned).toBeGreaterThan(0);
    expect([...risks].sort()).toEqual(["caution", "high", "low"]);
    const outs = [...rows.values()].map((r) => r.testsOut);
    expect(new Set(outs).size).toBeGreaterThan(1);
  });

  afterAll(async () => {
    for (const p of [si, ip]) if (p) await db.execute(sql`delete from projects where id = ${p.id}::uuid`);
  });
});
