// The server and the device describe each record type from one shared description
// (lib/records/descriptions.ts): the same schema objects, parent link and label on both sides.
// Source: the project's own rule "one home per concept" (STYLE.md) [common practice].
import { getTableColumns, is, SQL } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { RECORD_DESCRIPTIONS, defaultValues } from "@/lib/records/descriptions";
import { RECORD_TYPES, getRecordDef } from "@/lib/records/registry";
import { LOCAL_TYPES, localDef } from "@/lib/sync/client/record-types";

describe("record descriptions", () => {
  it("covers every record type on both sides, and nothing else", () => {
    expect(Object.keys(RECORD_DESCRIPTIONS).sort()).toEqual([...RECORD_TYPES].sort());
    expect(Object.keys(LOCAL_TYPES).sort()).toEqual([...RECORD_TYPES].sort());
  });

  it.each(RECORD_TYPES)("%s: the server and the device share its schemas, parent, label and mergeable fields", (type) => {
    const shared = RECORD_DESCRIPTIONS[type];
    const server = getRecordDef(type);
    const device = localDef(type);
    for (const side of [server, device]) {
      expect(side.type).toBe(type);
      expect(side.create).toBe(shared.create);
      expect(side.update).toBe(shared.update);
      expect(side.serverDefaults).toBe(shared.serverDefaults);
      expect(side.label).toBe(shared.label);
      expect(side.parent).toBe("parent" in shared ? shared.parent : undefined);
      expect(side.mergeable).toBe(shared.mergeable);
    }
    expect(device.parentField).toBe(server.parent?.field);
  });

  it("derives the device's defaults from the zod defaults", () => {
    // db/schema/placements.ts: level and grid default to "", a new placement is "planned".
    expect(localDef("placements").defaults).toEqual({ level: "", grid: "", state: "planned", leastDimensionMm: null, plannedVolumeM3: null, mixId: null });
    // db/schema/mixes.ts: f'c at 28 days, a target slump, no water added at site.
    expect(defaultValues("mix-designs")).toMatchObject({ fcAgeDays: 28, slumpType: "target", siteWaterAllowedLPerM3: 0, lowBleed: false });
    expect(localDef("breaks").defaults).toEqual({});
  });

  it("keeps the defaults out of the create and update schemas (a default in a patch would overwrite stored values)", () => {
    const parsed = RECORD_DESCRIPTIONS.placements.update.parse({ element: "Wall W3" });
    expect(parsed).toEqual({ element: "Wall W3" });
  });

  it.each(RECORD_TYPES)("%s: each zod default is the column default of db/schema (or null for a nullable column)", (type) => {
    const columns = getTableColumns(getRecordDef(type).table);
    for (const [field, value] of Object.entries(defaultValues(type))) {
      const col = columns[field];
      expect(col, `${type}.${field} is a column`).toBeDefined();
      if (col.hasDefault && !is(col.default, SQL)) expect(value, `${type}.${field}`).toEqual(col.default);
      else expect(col.notNull, `${type}.${field} has no column default, so it must be nullable`).toBe(false);
    }
  });
});
