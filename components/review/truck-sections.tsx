// The trucks and fresh-concrete tests of a placement on the office review: one row per ticket or
// test, in the project's units and time zone, with the office's corrections and each row's history.
import { AuditTrail } from "@/components/audit/audit-trail";
import { Correction } from "@/components/review/correction";
import { Empty, MiniTable, Section } from "@/components/review/detail-parts";
import { StateBadge } from "@/components/ui/state-badge";
import { formatDensity, formatLength, formatTemperature, formatVolume, formatWaterVolume, type UnitSystem } from "@/lib/concrete/units";
import type { Finding } from "@/lib/checks";
import type { PlacementReview } from "@/lib/review/detail";
import { instantFormatter } from "@/lib/time/zone";
import { SEVERITY_WORDS, wordFor } from "@/lib/ui/vocabulary";

type R = Record<string, unknown>;
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

export function TruckSections({
  deliveries,
  tests,
  mix,
  projectId,
  timeZone: tz,
  units,
  lateTrucks,
  canCorrect,
}: {
  deliveries: R[];
  tests: R[];
  mix: PlacementReview["mix"];
  projectId: string;
  timeZone: string;
  units: UnitSystem;
  /** The rulebook's late-truck findings (lib/checks), by delivery id. */
  lateTrucks: Map<string, Finding>;
  canCorrect: boolean;
}) {
  const time = instantFormatter(tz, "time");
  const t = (v: unknown) => (v ? time.format(new Date(v as string)) : "—");
  const ticket = new Map(deliveries.map((d) => [d.id as string, d.ticketNumber as string]));
  return (
    <>
        <Section title="Trucks" count={deliveries.length} testId="section-deliveries">
          {deliveries.length === 0 ? (
            <Empty>No truck tickets recorded.</Empty>
          ) : (
            <MiniTable
              testId="deliveries-table"
              head={["Ticket", "Volume", "Batched", "Arrived", "Discharged by", "Minutes", "Revolutions", "Water added", "Status", ""]}
              rows={deliveries.map((d) => {
                const minutes = d.dischargeFinishedAt ? (new Date(d.dischargeFinishedAt as string).getTime() - new Date(d.batchedAt as string).getTime()) / 60_000 : null;
                const late = lateTrucks.get(d.id as string);
                const water = num(d.waterAddedL);
                return {
                  key: d.id as string,
                  tone: d.status === "rejected" ? wordFor("delivery", "rejected").tone : late ? SEVERITY_WORDS.warning.tone : undefined,
                  cells: [
                    <span key="t" className="font-semibold">{d.ticketNumber as string}{d.truck ? <span className="ml-1 font-normal text-muted">truck {d.truck as string}</span> : null}</span>,
                    <span key="v">
                      {formatVolume(Number(d.volumeM3), units, 1)}
                      {canCorrect ? <Correction projectId={projectId} type="deliveries" id={d.id as string} version={d.version as number} field="volumeM3" quantity="volume" valueSI={num(d.volumeM3)} unitSystem={units} label="Volume" testId={`correct-volume-${d.ticketNumber}`} /> : null}
                    </span>,
                    t(d.batchedAt),
                    t(d.arrivedAt),
                    t(d.dischargeFinishedAt),
                    minutes === null ? "—" : <span key="m" className={late ? "font-bold text-danger-700" : undefined}>{Math.round(minutes)}{late ? ` (over ${late.applied.limit})` : ""}</span>,
                    (d.revolutions as number | null) ?? "—",
                    <span key="w">
                      {water ? `${formatWaterVolume(water, units)}${d.waterAddedBy ? ` by ${d.waterAddedBy}` : ""}${d.waterAuthorisedBy ? `, authorised ${d.waterAuthorisedBy}` : ""}` : "—"}
                      {canCorrect ? <Correction projectId={projectId} type="deliveries" id={d.id as string} version={d.version as number} field="waterAddedL" quantity="waterVolume" valueSI={water} unitSystem={units} label="Water added" testId={`correct-water-${d.ticketNumber}`} /> : null}
                    </span>,
                    <span key="s" className="flex flex-col items-start gap-0.5"><StateBadge kind="delivery" code={d.status as string} size="sm" testId="delivery-status" />{d.status === "rejected" && d.rejectReason ? <span className="text-xs">{d.rejectReason as string}</span> : null}</span>,
                    <AuditTrail look="inline" key="a" projectId={projectId} recordId={d.id as string} timeZone={tz} />,
                  ],
                };
              })}
            />
          )}
        </Section>

        <Section title="Fresh-concrete tests" count={tests.length} testId="section-tests">
          {tests.length === 0 ? (
            <Empty>No tests recorded.</Empty>
          ) : (
            <MiniTable
              head={["Sampled", "Ticket", "Slump", "Slump flow", "Air", "Concrete", "Air temp.", "Density", "Notes", ""]}
              rows={tests.map((x) => ({
                key: x.id as string,
                cells: [
                  t(x.sampledAt),
                  x.deliveryId ? (ticket.get(x.deliveryId as string) ?? "—") : "—",
                  num(x.slumpMm) === null ? "—" : formatLength(num(x.slumpMm)!, units),
                  num(x.slumpFlowMm) === null ? "—" : formatLength(num(x.slumpFlowMm)!, units),
                  num(x.airPct) === null ? "—" : `${Number(x.airPct).toFixed(1)} %`,
                  num(x.concreteTempC) === null ? "—" : formatTemperature(num(x.concreteTempC)!, units),
                  num(x.airTempC) === null ? "—" : formatTemperature(num(x.airTempC)!, units),
                  num(x.densityKgM3) === null ? "—" : formatDensity(num(x.densityKgM3)!, units),
                  (x.notes as string) || "",
                  <AuditTrail look="inline" key="a" projectId={projectId} recordId={x.id as string} timeZone={tz} />,
                ],
              }))}
            />
          )}
          {mix ? <p className="mt-1 text-xs text-muted">Mix {mix.code}: slump {mix.slumpTargetMm === null ? "not specified" : `${mix.slumpType === "maximum" ? "not to exceed" : "target"} ${formatLength(mix.slumpTargetMm, units)}`}; air {mix.airTargetPct === null ? "not specified" : `${mix.airTargetPct} %`}.</p> : null}
        </Section>
    </>
  );
}
