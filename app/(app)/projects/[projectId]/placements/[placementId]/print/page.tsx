import type { Metadata } from "next";
import { elementTypeLabel } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PrintButton } from "@/components/signoff/print-button";
import { Notice } from "@/components/ui/notice";
import { ROLE_LABELS, type ProjectRole } from "@/lib/auth/roles";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { formatLength, formatTemperature, formatVolume, formatWaterVolume, formatSpeed, formatEvaporation, type UnitSystem } from "@/lib/concrete";
import { AppError } from "@/lib/errors";
import { placementStateLabel } from "@/lib/ui/vocabulary";
import { loadPlacementPrint } from "@/lib/signoff/print";
import { formatInstant } from "@/lib/time/zone";

export const metadata: Metadata = { title: "Placement record" };

type Row = Record<string, unknown>;
const n = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);
const s = (v: unknown) => (typeof v === "string" ? v : "");

function when(value: unknown, timeZone: string): string {
  if (!value) return "—";
  const d = value instanceof Date ? value : new Date(String(value));
  if (Number.isNaN(d.getTime())) return "—";
  return formatInstant(d, timeZone, "yearDayTimeZone");
}
const time = (value: unknown, timeZone: string) =>
  value ? formatInstant(value instanceof Date ? value : String(value), timeZone, "time") : "—";
const answerWord = (a: unknown) => (a === "yes" ? "Yes" : a === "no" ? "No" : a === "na" ? "N/A" : "—");
const roleWord = (r: string) => ROLE_LABELS[r as ProjectRole] ?? r;

function Table({ head, rows, testId }: { head: string[]; rows: (string | number)[][]; testId?: string }) {
  if (rows.length === 0) return <p className="text-sm text-muted">None recorded.</p>;
  return (
    <table className="w-full border-collapse text-sm" data-testid={testId}>
      <thead>
        <tr>
          {head.map((h) => (
            <th key={h} className="border-b-2 border-ink-300 px-2 py-1 text-left font-semibold">
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className="break-inside-avoid">
            {r.map((c, j) => (
              <td key={j} className="border-b border-ink-200 px-2 py-1 align-top">
                {c}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Block({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="break-inside-avoid-page border-t border-ink-300 pt-3" aria-label={title}>
      <h2 className="mb-2 text-lg font-bold">{title}</h2>
      {children}
    </section>
  );
}

export default async function PlacementPrintPage({ params }: { params: Promise<{ projectId: string; placementId: string }> }) {
  const { projectId, placementId } = await params;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId) || !/^[0-9a-f-]{36}$/i.test(placementId)) notFound();
  let data;
  try {
    data = await loadPlacementPrint(await accessTo(user, projectId), placementId);
  } catch (error) {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "forbidden")) {
      return (
        <Notice tone="danger" title="This placement is not available to you." testId="print-forbidden">
          It is not on a project you are a member of, or it does not exist.
        </Notice>
      );
    }
    throw error;
  }
  const { project, placement: p, children, photos, mixCode, verification: v } = data;
  const tz = project.timeZone;
  const units: UnitSystem = project.unitSystem === "IP" ? "IP" : "SI";
  const items = (children["checklist-items"] ?? []) as Row[];
  const deliveries = ((children.deliveries ?? []) as Row[]).sort((a, b) => String(a.batchedAt ?? "").localeCompare(String(b.batchedAt ?? "")));
  const ticketOf = new Map(deliveries.map((d) => [d.id, s(d.ticketNumber)]));

  return (
    <article className="mx-auto flex max-w-4xl flex-col gap-4 bg-white p-4 text-ink-950 print:max-w-none print:p-0" data-testid="placement-print">
      <div className="no-print flex flex-wrap gap-2">
        <PrintButton />
        <Link href={`/field/placement?id=${placementId}`} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold">
          Back to the placement
        </Link>
      </div>
      <header>
        <p className="text-sm text-muted">
          {project.name} · {project.code}
        </p>
        <h1 className="text-2xl font-bold">{s(p.element)}</h1>
        <p className="text-base">
          {[s(p.level), s(p.grid)].filter(Boolean).join(" · ") || "—"} · {elementTypeLabel(p.elementType).toLowerCase()} · mix {mixCode ?? "not chosen"} · planned{" "}
          {n(p.plannedVolumeM3) !== null ? formatVolume(n(p.plannedVolumeM3)!, units) : "—"}
          {n(p.leastDimensionMm) !== null ? ` · least dimension ${formatLength(n(p.leastDimensionMm)!, units)}` : ""} · start {when(p.plannedStart, tz)}
        </p>
        <p className="mt-1 text-base font-semibold" data-testid="print-state">
          State: {placementStateLabel(s(p.state))}
        </p>
      </header>

      <div className="grid gap-4 md:grid-cols-2 print:grid-cols-2">
        <Block title="Sign-off">
          {v.signed ? (
            <div data-testid="print-sign-off">
              {v.signOff.signatureImage ? (
                // eslint-disable-next-line @next/next/no-img-element -- a stored data URL
                <img src={v.signOff.signatureImage} alt={`Signature of ${v.signOff.typedName}`} className="h-24 w-full max-w-xs border border-ink-200 object-contain" />
              ) : null}
              <p className="mt-1 text-base">
                <span className="font-semibold">{v.signOff.typedName}</span> ({roleWord(v.signOff.role)}
                {v.signOff.signerName && v.signOff.signerName !== v.signOff.typedName ? `, account ${v.signOff.signerName}` : ""})
              </p>
              <p className="text-sm">{when(v.signOff.signedAt, tz)}</p>
              <p className="mt-2 text-xs">
                Signature check code (SHA-256 of the record at signing): <code className="break-all font-mono" data-testid="print-hash">{v.signOff.contentHash}</code>
              </p>
              <p className="mt-1 text-sm font-semibold" data-testid="print-verify">
                {v.matches ? "Verified when printed: the stored record matches what was signed." : "WARNING: the stored record no longer matches what was signed."}
              </p>
            </div>
          ) : (
            <p className="text-base font-semibold" data-testid="print-unsigned">
              Not signed. This print is a working copy, not the signed record.
            </p>
          )}
        </Block>
        <Block title={`Amendments (${v.amendments.length})`}>
          {v.amendments.length === 0 ? <p className="text-sm text-muted">None.</p> : null}
          <ol className="flex flex-col gap-2" data-testid="print-amendments">
            {v.amendments.map((a, i) => (
              <li key={a.id} className="break-inside-avoid border-l-4 border-ink-400 pl-2 text-sm">
                <p className="font-semibold">
                  {i + 1}. {a.what}
                </p>
                <p>Why: {a.why}</p>
                <p className="text-muted">
                  {a.authorName ?? "—"} · {when(a.createdAt, tz)}
                  {a.signOff ? ` · signed by ${a.signOff.typedName} (${roleWord(a.signOff.role)}) ${when(a.signOff.signedAt, tz)}${a.matches ? "" : " — TEXT CHANGED SINCE SIGNED"}` : " · not signed"}
                </p>
                {a.signOff?.signatureImage ? (
                  // eslint-disable-next-line @next/next/no-img-element -- a stored data URL
                  <img src={a.signOff.signatureImage} alt={`Signature of ${a.signOff.typedName}`} className="mt-1 h-12 max-w-[12rem] object-contain" />
                ) : null}
              </li>
            ))}
          </ol>
        </Block>
      </div>

      <Block title={`Trucks (${deliveries.length})`}>
        <Table
          testId="print-trucks"
          head={["Ticket", "Truck", "Volume", "Batched", "Arrived", "Discharge", "Water added", "Status"]}
          rows={deliveries.map((d) => [
            s(d.ticketNumber),
            s(d.truck) || "—",
            n(d.volumeM3) !== null ? formatVolume(n(d.volumeM3)!, units) : "—",
            time(d.batchedAt, tz),
            time(d.arrivedAt, tz),
            `${time(d.dischargeStartedAt, tz)}–${time(d.dischargeFinishedAt, tz)}`,
            n(d.waterAddedL) ? `${formatWaterVolume(n(d.waterAddedL)!, units)} by ${s(d.waterAddedBy) || "—"}, authorised ${s(d.waterAuthorisedBy) || "—"}` : "none",
            d.status === "rejected" ? `rejected: ${s(d.rejectReason)}` : "accepted",
          ])}
        />
      </Block>
      <Block title={`Field tests (${(children["field-tests"] ?? []).length})`}>
        <Table
          head={["Sampled", "Truck", "Slump", "Air", "Concrete", "Air temp.", "Notes"]}
          rows={((children["field-tests"] ?? []) as Row[]).map((t) => [
            time(t.sampledAt, tz),
            ticketOf.get(t.deliveryId) ?? "—",
            n(t.slumpMm) !== null ? formatLength(n(t.slumpMm)!, units) : "—",
            n(t.airPct) !== null ? `${n(t.airPct)} %` : "—",
            n(t.concreteTempC) !== null ? formatTemperature(n(t.concreteTempC)!, units) : "—",
            n(t.airTempC) !== null ? formatTemperature(n(t.airTempC)!, units) : "—",
            s(t.notes),
          ])}
        />
      </Block>
      <Block title={`Weather (${(children["weather-observations"] ?? []).length})`}>
        <Table
          head={["Time", "Air", "RH", "Wind", "Concrete", "Evaporation"]}
          rows={((children["weather-observations"] ?? []) as Row[]).map((o) => [
            time(o.observedAt, tz),
            n(o.airTempC) !== null ? formatTemperature(n(o.airTempC)!, units) : "—",
            n(o.relativeHumidityPct) !== null ? `${n(o.relativeHumidityPct)} %` : "—",
            n(o.windKmh) !== null ? formatSpeed(n(o.windKmh)!, units) : "—",
            n(o.concreteTempC) !== null ? formatTemperature(n(o.concreteTempC)!, units) : "—",
            n(o.evaporationKgM2H) !== null ? formatEvaporation(n(o.evaporationKgM2H)!, units) : "—",
          ])}
        />
      </Block>
      {((children.checklists ?? []) as Row[]).map((c) => (
        <Block key={s(c.id)} title={`Checklist: ${s(c.kind).replace(/-/g, " ")}`}>
          <Table
            head={["Item", "Answer", "Note"]}
            rows={items.filter((i) => i.checklistId === c.id).map((i) => [s(i.label), answerWord(i.answer), s(i.note)])}
          />
        </Block>
      ))}
      <Block title="Other records">
        <p className="text-sm">
          {(children["specimen-sets"] ?? []).length} specimen sets · {(children["curing-readings"] ?? []).length} curing readings · {photos.length} photos
        </p>
      </Block>
      <footer className="border-t border-ink-300 pt-2 text-xs text-muted">
        Printed {when(new Date(), tz)} from Placewright. Acceptance of the work is governed by the project specification, local codes and the engineer
        of record.
      </footer>
    </article>
  );
}
