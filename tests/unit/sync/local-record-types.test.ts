// The device's typed records: a screen that reads deliveries gets the delivery schema's fields with
// their types (inferred from lib/records/schemas/delivery.ts), stored as JSON (an instant is its ISO
// string). The type checks run in the typecheck (`tsc --noEmit` includes tests/); the runtime checks
// read a delivery back through the typed accessors and look at what IndexedDB really holds.
import "fake-indexeddb/auto";
import { afterEach, describe, expect, expectTypeOf, it } from "vitest";
import type { z } from "zod";
import { deliveryCreateSchema } from "@/lib/records/schemas/delivery";
import type { LocalRecord, LocalRecordBase } from "@/lib/sync/client/db";
import { createLocal } from "@/lib/sync/client/mutate";
import { getRecord, listByParent } from "@/lib/sync/client/queries";
import { cleanupDbs, freshDb, placementValues, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

type Truck = LocalRecord<"deliveries">;
type DeliveryOutput = z.output<typeof deliveryCreateSchema>;

describe("LocalRecord<type>: the schema's fields, as the device stores them", () => {
  it("a truck's fields have the delivery schema's types", () => {
    // Text and numbers exactly as the schema outputs them [the project's delivery schema].
    expectTypeOf<Truck["ticketNumber"]>().toEqualTypeOf<DeliveryOutput["ticketNumber"]>();
    expectTypeOf<Truck["ticketNumber"]>().toEqualTypeOf<string>();
    expectTypeOf<Truck["volumeM3"]>().toEqualTypeOf<number>();
    expectTypeOf<Truck["placementId"]>().toEqualTypeOf<string>();
    // Optional in a create and nullable in the table: may be missing on a row made on the device.
    expectTypeOf<Truck["revolutions"]>().toEqualTypeOf<number | null | undefined>();
    expectTypeOf<Truck["mixCode"]>().toEqualTypeOf<string | null | undefined>();
    // The server default fills it in, so it is always there [the project's deliveryDefaults].
    expectTypeOf<Truck["status"]>().toEqualTypeOf<"accepted" | "rejected">();
    expectTypeOf<Truck["truck"]>().toEqualTypeOf<string>();
    // An instant is a Date in the schema's output and its ISO string on the device (JSON).
    expectTypeOf<DeliveryOutput["batchedAt"]>().toEqualTypeOf<Date>();
    expectTypeOf<Truck["batchedAt"]>().toEqualTypeOf<string>();
    expectTypeOf<Truck["dischargeStartedAt"]>().toEqualTypeOf<string | null | undefined>();
    // The sync fields of every row.
    expectTypeOf<Truck["version"]>().toEqualTypeOf<number>();
    expectTypeOf<Truck["pending"]>().toEqualTypeOf<0 | 1>();
    expectTypeOf<Truck["deletedAt"]>().toEqualTypeOf<string | null>();
    // Written only by the workflow, null until then [the project's placementServerWritten].
    expectTypeOf<LocalRecord<"placements">["holdReason"]>().toEqualTypeOf<string | null>();
    expectTypeOf<LocalRecord<"placements">["signedAt"]>().toEqualTypeOf<string | null>();
  });

  it("without a type the row stays the loose base the sync code works on", () => {
    expectTypeOf<LocalRecord>().toEqualTypeOf<LocalRecordBase>();
    expectTypeOf<LocalRecordBase["volumeM3"]>().toEqualTypeOf<unknown>();
    expectTypeOf<Truck>().toMatchTypeOf<LocalRecordBase>();
  });

  it("the typed accessors return the typed row, and the stored values match those types", async () => {
    const db = await freshDb();
    const { id: placementId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    const { id } = await createLocal(db, "deliveries", PROJECT_ID, {
      placementId,
      ticketNumber: "BR-40211",
      volumeM3: 8,
      batchedAt: "2026-11-09T06:40:00-06:00",
      arrivedAt: "2026-11-09T07:05:00-06:00",
    });
    const truck = await getRecord(db, "deliveries", id);
    expectTypeOf(truck).toEqualTypeOf<Truck | undefined>();
    const listed = await listByParent(db, "deliveries", "placementId", placementId);
    expectTypeOf(listed).toEqualTypeOf<Truck[]>();
    expect(listed.map((d) => d.id)).toEqual([id]);
    // What the types promise is what IndexedDB holds [ECMA-262 Date Time String Format: toISOString is UTC "Z"].
    expect(typeof truck?.volumeM3).toBe("number");
    expect(typeof truck?.ticketNumber).toBe("string");
    expect(truck?.batchedAt).toBe("2026-11-09T12:40:00.000Z");
    expect(truck?.status).toBe("accepted");
    expect(truck?.truck).toBe("");
  });
});
