import { z } from "zod";
import { DELIVERY_STATUSES } from "@/lib/records/enums";
import { choice, clientId, pastInstant, measure, optionalText, ordered, recordId, requiredText, wholeNumber } from "./fields";

export const deliveryFields = {
  ticketNumber: requiredText("Ticket number", 40),
  truck: optionalText("Truck", 40),
  volumeM3: measure("Volume", 0, 20, "m³"),
  mixCode: optionalText("Mix code on the ticket", 40).nullable(),
  batchedAt: pastInstant("Batch time"),
  arrivedAt: pastInstant("Arrival time"),
  dischargeStartedAt: pastInstant("Discharge start").nullable(),
  dischargeFinishedAt: pastInstant("Discharge end").nullable(),
  revolutions: wholeNumber("Drum revolutions", 0, 2_000).nullable(),
  waterAddedL: measure("Water added", 0, 2_000, "L").nullable(),
  waterFirstAt: pastInstant("Time of the first water").nullable(),
  waterLastAt: pastInstant("Time of the last water").nullable(),
  waterAddedBy: optionalText("Water added by", 120).nullable(),
  waterAuthorisedBy: optionalText("Water authorised by", 120).nullable(),
  admixtureNote: optionalText("Admixture note", 1_000).nullable(),
  status: choice("Status", DELIVERY_STATUSES),
  rejectReason: optionalText("Reason for rejecting", 1_000).nullable(),
  notClearedReason: optionalText("Reason for concrete on a placement that is not cleared", 1_000).nullable(),
};

type DeliveryShape = {
  batchedAt?: Date;
  arrivedAt?: Date;
  dischargeStartedAt?: Date | null;
  dischargeFinishedAt?: Date | null;
  waterAddedL?: number | null;
  waterFirstAt?: Date | null;
  waterLastAt?: Date | null;
  status?: string;
  rejectReason?: string | null;
};

// ASTM C94 times run batch → arrival → discharge start → discharge end; water at site is one
// addition whose portions have a first and a last time. Checks only the times that are present,
// so it also suits a patch (the whole record is checked again after merging).
export function checkDeliveryOrder(v: DeliveryShape, ctx: z.RefinementCtx) {
  ordered(ctx, v.batchedAt, v.arrivedAt, "arrivedAt", "Arrival must be after batching");
  ordered(ctx, v.arrivedAt, v.dischargeStartedAt, "dischargeStartedAt", "Discharge must start after the truck arrived");
  ordered(ctx, v.dischargeStartedAt, v.dischargeFinishedAt, "dischargeFinishedAt", "Discharge must finish after it started");
  ordered(ctx, v.batchedAt, v.dischargeFinishedAt, "dischargeFinishedAt", "Discharge must finish after batching");
  ordered(ctx, v.waterFirstAt, v.waterLastAt, "waterLastAt", "The last water must be after the first");
  ordered(ctx, v.batchedAt, v.waterFirstAt, "waterFirstAt", "Water cannot be added before batching");
}

/** The complete record: times in order, and what a stated fact needs (a rejection needs its reason). */
export function checkDelivery(v: DeliveryShape, ctx: z.RefinementCtx) {
  checkDeliveryOrder(v, ctx);
  if (v.dischargeFinishedAt && !v.dischargeStartedAt) {
    ctx.addIssue({ code: "custom", path: ["dischargeStartedAt"], message: "Enter when the discharge started" });
  }
  if (typeof v.waterAddedL === "number" && v.waterAddedL > 0 && !v.waterFirstAt) {
    ctx.addIssue({ code: "custom", path: ["waterFirstAt"], message: "Enter when the water was added" });
  }
  if (v.status === "rejected" && !v.rejectReason) {
    ctx.addIssue({ code: "custom", path: ["rejectReason"], message: "Say why the load was rejected" });
  }
}

export const deliveryCreateSchema = z
  .object({ id: clientId, placementId: recordId("Placement"), ...deliveryFields })
  .partial({
    truck: true,
    mixCode: true,
    dischargeStartedAt: true,
    dischargeFinishedAt: true,
    revolutions: true,
    waterAddedL: true,
    waterFirstAt: true,
    waterLastAt: true,
    waterAddedBy: true,
    waterAuthorisedBy: true,
    admixtureNote: true,
    status: true,
    rejectReason: true,
    notClearedReason: true,
  })
  .superRefine(checkDelivery);

export const deliveryUpdateSchema = z.object(deliveryFields).partial().superRefine(checkDeliveryOrder);

export type DeliveryInput = z.input<typeof deliveryCreateSchema>;

/** What the server fills in when a create leaves a field out (db/schema/deliveries.ts). */
export const deliveryDefaults = z.object({
  truck: deliveryFields.truck.default(""),
  status: deliveryFields.status.default("accepted"),
});
