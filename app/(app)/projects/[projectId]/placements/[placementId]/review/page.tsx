import type { Metadata } from "next";
import { elementTypeLabel } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StoredPhotos, type StoredPhoto } from "@/components/photos/stored-photos";
import { AuditTrail } from "@/components/audit/audit-trail";
import { Correction } from "@/components/review/correction";
import { TruckSections } from "@/components/review/truck-sections";
import { Empty, Facts, MiniTable, Section } from "@/components/review/detail-parts";
import { Notice } from "@/components/ui/notice";
import { OfficeMaturity } from "@/components/maturity/office-maturity";
import { loadMaturityRecords } from "@/lib/maturity/records";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo, type ProjectAccess } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { formatEvaporation, formatLength, formatSpeed, formatStrength, formatTemperature, formatVolume } from "@/lib/concrete/units";
import { GOVERNS, citation, evaluate, toCheckInput } from "@/lib/checks";
import { AppError } from "@/lib/errors";
import { StateBadge } from "@/components/ui/state-badge";
import { severityOf, TONES, warningWord } from "@/lib/ui/vocabulary";
import { instantFormatter } from "@/lib/time/zone";
import { loadPlacementReview, type PlacementReview } from "@/lib/review/detail";

export const metadata: Metadata = { title: "Placement review" };

type R = Record<string, unknown>;
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

export default async function PlacementReviewPage({ params }: { params: Promise<{ projectId: string; placementId: string }> }) {
  const { projectId, placementId } = await params;
  const user = await requireUser();
  let data: PlacementReview;
  let access: ProjectAccess;
  try {
    access = await accessTo(user, projectId);
    data = await loadPlacementReview(access, placementId);
  } catch (error) {
    if (error instanceof AppError && error.code === "forbidden") return <Notice tone="danger" title="This placement is not available to you.">{error.message}</Notice>;
    if (error instanceof AppError && (error.code === "not_found" || error.code === "invalid_input")) notFound();
    throw error;
  }
  const { project, placement: p, mix, children, canCorrect } = data;
  const maturity = await loadMaturityRecords(access, placementId, (p.mixId as string | null) ?? null);
  const units = project.unitSystem;
  const tz = project.timeZone;
  const time = instantFormatter(tz, "time");
  const dayTime = instantFormatter(tz, "dayTime");
  const t = (v: unknown) => (v ? time.format(new Date(v as string)) : "—");
  const deliveries = children.deliveries as R[];
  const tests = children["field-tests"] as R[];
  const weather = children["weather-observations"] as R[];
  const checklists = children.checklists as R[];
  const items = children["checklist-items"] as R[];
  const curing = children["curing-readings"] as R[];
  const sets = children["specimen-sets"] as R[];
  const ticket = new Map(deliveries.map((d) => [d.id as string, d.ticketNumber as string]));
  // Late trucks as the rulebook judges them, not a second copy of the discharge limit.
  const lateTrucks = new Map(
    evaluate(toCheckInput({ project, mixes: [], placements: [], deliveries }))
      .filter((f) => f.rule === "discharge-time")
      .map((f) => [f.subject.id, f]),
  );
  const openConflicts = data.conflicts.filter((c) => !c.resolvedAt);
  const photoRecords: [string, string, string][] = [
    ["placements", p.id as string, "Placement photos"],
    ...deliveries.map((d) => ["deliveries", d.id as string, `Ticket ${d.ticketNumber}`] as [string, string, string]),
  ];

  return (
    <div className="space-y-3" data-testid="placement-review">
      <PageHeader
        title={p.element as string}
        subtitle={
          <>
            <Link href={`/projects/${projectId}`} className="underline-offset-4 hover:underline">{project.name}</Link>
            {` · ${data.date} · ${[p.level, p.grid].filter(Boolean).join(" · ")}`}
          </>
        }
        actions={
          <>
            <Link href="/review" className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50">Back to review</Link>
            <Link href={`/projects/${projectId}/lab?placement=${placementId}`} className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50" data-testid="lab-link">Specimens and breaks</Link>
            <Link href={`/projects/${projectId}/diary/${data.date}`} className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50">Diary of the day</Link>
            <a href={`/api/projects/${projectId}/reports/daily?date=${data.date}`} className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50" data-testid="daily-pdf">Daily report (PDF)</a>
          </>
        }
      />
      <Section title="Placement" testId="section-placement">
        <Facts
          items={[
            ["State", <span key="s" className="inline-flex flex-wrap items-center gap-2"><StateBadge kind="placement" code={p.state as string} testId="placement-state" />{p.state === "held" && p.holdReason ? <span className="font-semibold" data-testid="placement-hold-reason">{p.holdReason as string}</span> : null}</span>],
            ["Planned start", dayTime.format(new Date(p.plannedStart as string))],
            ["Element type", elementTypeLabel(p.elementType)],
            ["Least dimension", num(p.leastDimensionMm) === null ? "—" : formatLength(num(p.leastDimensionMm)!, units)],
            [
              "Ordered",
              <span key="o">
                {num(p.plannedVolumeM3) === null ? "—" : formatVolume(num(p.plannedVolumeM3)!, units, 1)}
                {canCorrect ? <Correction projectId={projectId} type="placements" id={p.id as string} version={p.version as number} field="plannedVolumeM3" quantity="volume" valueSI={num(p.plannedVolumeM3)} unitSystem={units} label="Ordered volume" testId="correct-ordered" /> : null}
              </span>,
            ],
            ["Placed (accepted trucks)", formatVolume(deliveries.filter((d) => d.status !== "rejected").reduce((s, d) => s + Number(d.volumeM3), 0), units, 1)],
            ["Mix", mix ? `${mix.code} · f'c ${formatStrength(mix.fcMPa, units)} at ${mix.fcAgeDays} d${mix.supplier ? ` · ${mix.supplier}` : ""}` : "—"],
            ["Signed", p.signedAt ? dayTime.format(new Date(p.signedAt as string)) : "Not signed"],
          ]}
        />
        <div className="mt-2">
          <AuditTrail look="inline" projectId={projectId} recordId={p.id as string} timeZone={tz} label="Audit trail" />
        </div>
      </Section>

      <Section title="Warnings" count={data.warnings.length} testId="section-warnings">
        {data.warnings.length === 0 ? (
          <Empty>No warnings from the recorded trucks, tests and weather.</Empty>
        ) : (
          <ul className="space-y-1.5">
            {data.warnings.map((w, i) => (
              <li key={i} className={`rounded border-l-4 px-2 py-1 ${TONES[warningWord(w).tone].className}`} data-testid="warning" data-rule={w.rule}>
                <p className="flex items-center gap-1.5 text-sm font-semibold">
                  <StateBadge kind="severity" code={severityOf(w)} size="sm" />
                  {w.title}
                </p>
                <p className="text-sm">{w.message}</p>
                <p className="text-xs text-muted">Rule: {citation(w.source)}</p>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-xs text-muted">{GOVERNS}</p>
      </Section>

      {openConflicts.length ? (
        <Notice tone="caution" title={`${openConflicts.length} open sync conflict${openConflicts.length === 1 ? "" : "s"} on this placement's records`}>
          The field resolves them on the device that sent them; the record cannot be signed until they are.
        </Notice>
      ) : null}

      <TruckSections deliveries={deliveries} tests={tests} mix={mix} projectId={projectId} timeZone={tz} units={units} lateTrucks={lateTrucks} canCorrect={canCorrect} />

      <Section title="Weather" count={weather.length} testId="section-weather">
        {weather.length === 0 ? (
          <Empty>No readings for this placement.</Empty>
        ) : (
          <MiniTable
            head={["Time", "Air", "Humidity", "Wind", "Concrete", "Sun", "Evaporation"]}
            rows={weather.map((w) => ({
              key: w.id as string,
              cells: [t(w.observedAt), formatTemperature(Number(w.airTempC), units), `${Math.round(Number(w.relativeHumidityPct))} %`, formatSpeed(Number(w.windKmh), units), num(w.concreteTempC) === null ? "—" : formatTemperature(num(w.concreteTempC)!, units), (w.sun as string | null) ?? "—", num(w.evaporationKgM2H) === null ? "—" : formatEvaporation(num(w.evaporationKgM2H)!, units, units === "SI" ? 2 : 3)],
            }))}
          />
        )}
      </Section>

      <div className="grid gap-3 lg:grid-cols-2">
        <Section title="Checklists" count={checklists.length} testId="section-checklists">
          {checklists.length === 0 ? (
            <Empty>No checklists.</Empty>
          ) : (
            checklists.map((c) => {
              const mine = items.filter((i) => i.checklistId === c.id);
              return (
                <div key={c.id as string} className="mb-2">
                  <p className="text-sm font-semibold capitalize">{(c.kind as string).replace("-", " ")}</p>
                  <ul className="text-sm">
                    {mine.map((i) => (
                      <li key={i.id as string} className="flex gap-2">
                        <span className={i.answer === "no" ? "w-8 font-bold text-danger-700" : i.answer ? "w-8 font-semibold" : "w-8 text-muted"}>{i.answer ? String(i.answer).toUpperCase() : "—"}</span>
                        <span>{i.label as string}{i.note ? <span className="text-muted"> · {i.note as string}</span> : null}</span>
                      </li>
                    ))}
                  </ul>
                </div>
              );
            })
          )}
        </Section>
        <Section title="Curing" count={curing.length} testId="section-curing">
          {curing.length === 0 ? (
            <Empty>No curing readings.</Empty>
          ) : (
            <MiniTable head={["Read", "Method", "Temperature", "Location", "Note"]} rows={curing.map((c) => ({ key: c.id as string, cells: [dayTime.format(new Date(c.readAt as string)), c.method as string, formatTemperature(Number(c.tempC), units), c.location as string, (c.note as string | null) ?? ""] }))} />
          )}
        </Section>
      </div>

      <Section title="Temperature & maturity" count={maturity.sensors.length} testId="section-maturity">
        <OfficeMaturity project={project} placement={{ ...p, id: placementId }} mixCode={mix ? String(mix.code) : null} records={maturity} />
      </Section>
      <Section title="Specimen sets" count={sets.length} testId="section-specimens" actions={<Link href={`/projects/${projectId}/lab?placement=${placementId}`} className="text-sm font-semibold text-lichen-800 hover:underline">Specimens and breaks</Link>}>
        {sets.length === 0 ? (
          <Empty>No specimens cast.</Empty>
        ) : (
          <MiniTable head={["Set", "Cylinders", "Cast", "Test ages", "Ticket"]} rows={sets.map((s) => ({ key: s.id as string, cells: [s.setCode as string, `${s.count} × ${s.cylinderDiameterMm} mm`, dayTime.format(new Date(s.castAt as string)), `${(s.testAgesDays as number[]).join(", ")} d`, s.deliveryId ? (ticket.get(s.deliveryId as string) ?? "—") : "—"] }))} />
        )}
      </Section>

      <Section title="Photos" count={data.photos.length} testId="section-photos">
        {photoRecords.map(([, id, title]) => (
          <StoredPhotos key={id} projectId={projectId} title={title} photos={(data.photos as StoredPhoto[]).filter((ph) => (ph as unknown as R).recordId === id)} />
        ))}
        {data.photos.length === 0 ? <Empty>No photos.</Empty> : <p className="text-xs text-muted">{data.photos.length} photo{data.photos.length === 1 ? "" : "s"} attached to this placement&apos;s records.</p>}
      </Section>

      <div className="grid gap-3 lg:grid-cols-2">
        <Section title="Sign-off" count={data.signatures.length} testId="section-signoff">
          {data.signatures.length === 0 ? (
            <Empty>Not signed yet.</Empty>
          ) : (
            data.signatures.map((s) => (
              <div key={s.id} className="flex items-center gap-3 text-sm">
                {s.signatureImage ? (
                  // eslint-disable-next-line @next/next/no-img-element -- a stored data URL, not an optimisable asset
                  <img src={s.signatureImage} alt={`Signature of ${s.typedName}`} className="h-12 w-32 rounded border border-ink-200 bg-white object-contain" />
                ) : null}
                <div>
                  <p className="font-semibold">{s.typedName} <span className="font-normal text-muted">({s.role}{s.signerName && s.signerName !== s.typedName ? `, account ${s.signerName}` : ""})</span></p>
                  <p className="text-xs text-muted">{dayTime.format(new Date(s.signedAt!))} · signature check code {s.contentHash.slice(0, 12)}…</p>
                </div>
              </div>
            ))
          )}
        </Section>
        <Section title="Amendments" count={data.amendments.length} testId="section-amendments">
          {data.amendments.length === 0 ? (
            <Empty>No amendments.</Empty>
          ) : (
            <ul className="space-y-1 text-sm">
              {data.amendments.map((a) => (
                <li key={a.id}>
                  <p className="font-semibold">{a.what}</p>
                  <p>{a.why}</p>
                  <p className="text-xs text-muted">{a.authorName} · {dayTime.format(new Date(a.createdAt))}</p>
                </li>
              ))}
            </ul>
          )}
        </Section>
      </div>

      <Section title="Sync conflicts" count={data.conflicts.length} testId="section-conflicts">
        {data.conflicts.length === 0 ? (
          <Empty>None.</Empty>
        ) : (
          <MiniTable head={["When", "Record", "Reason", "Status"]} rows={data.conflicts.map((c) => ({ key: c.id, tone: c.resolvedAt ? undefined : "caution", cells: [dayTime.format(new Date(c.createdAt)), c.recordType, c.reason, c.resolvedAt ? `Resolved ${dayTime.format(new Date(c.resolvedAt))}` : "Open"] }))} />
        )}
      </Section>
      {canCorrect ? <p className="text-xs text-muted">Corrections go through the same records API as the field, with an audit entry; a signed placement is frozen and takes amendments instead.</p> : null}
    </div>
  );
}
