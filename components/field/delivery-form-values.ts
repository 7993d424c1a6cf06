// The truck form's values: what a stored ticket shows in the inputs (project units, project clock).
import type { UnitSystem } from "@/lib/concrete";
import type { LocalRecord } from "@/lib/sync/client";
import { fromSI } from "./unit-inputs";
import { clockOf } from "./delivery-times";

export type Values = {
  ticketNumber: string;
  truck: string;
  volume: string;
  mixCode: string;
  batchDate: string;
  batchedAt: string;
  arrivedAt: string;
  dischargeStartedAt: string;
  dischargeFinishedAt: string;
  revolutions: string;
  water: string;
  waterFirstAt: string;
  waterLastAt: string;
  waterAddedBy: string;
  waterAuthorisedBy: string;
  admixtureNote: string;
  status: "accepted" | "rejected";
  rejectReason: string;
  notClearedReason: string;
};

export const FIELD_OF: Record<string, keyof Values> = { volumeM3: "volume", waterAddedL: "water" };

export function valuesOf(d: LocalRecord<"deliveries"> | null, units: UnitSystem, timeZone: string): Values {
  const { clock, date } = clockOf(d ?? {}, timeZone);
  return {
    ticketNumber: (d?.ticketNumber ?? ""),
    truck: (d?.truck ?? ""),
    volume: d ? fromSI("volume", d.volumeM3, units) : "",
    mixCode: (d?.mixCode ?? ""),
    batchDate: date ?? "",
    ...clock,
    revolutions: typeof d?.revolutions === "number" ? String(d.revolutions) : "",
    water: d ? fromSI("waterVolume", d.waterAddedL, units, 1) : "",
    waterAddedBy: (d?.waterAddedBy ?? ""),
    waterAuthorisedBy: (d?.waterAuthorisedBy ?? ""),
    admixtureNote: (d?.admixtureNote ?? ""),
    status: d?.status === "rejected" ? "rejected" : "accepted",
    rejectReason: (d?.rejectReason ?? ""),
    notClearedReason: (d?.notClearedReason ?? ""),
  };
}

export const wholeOrNull = (text: string) => (text.trim() === "" ? null : Number(text.trim()));

