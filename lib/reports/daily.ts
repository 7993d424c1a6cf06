// The PDF daily report of one project and one project-local date: what the field recorded that day
// (the digest's loader and summary, so the figures and warnings match the e-mail and the review
// list), plus checklists, photo thumbnails (when the bytes are stored) and signatures.
import { drawSiteStatus } from "./site-status";
import type { PDFImage } from "pdf-lib";
import { z } from "zod";
import { parseOrThrow } from "@/lib/validation";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { formatEvaporation, formatLength, formatSpeed, formatTemperature } from "@/lib/concrete";
import { GOVERNS, citation } from "@/lib/checks";
import { loadDigestDay } from "@/lib/digest/load";
import { formatInstant, isLocalDate } from "@/lib/time/zone";
import { summarizeDay } from "@/lib/digest/summary";
import { readObject } from "@/lib/photos/storage";
import { MAX_PHOTO_PIXELS, MAX_REPORT_PHOTOS, MAX_SIGNATURE_PIXELS, thumbnail } from "./thumbnails";
import { DELIVERY_STATUS_WORDS, warningWord, wordFor } from "@/lib/ui/vocabulary";
import { loadReportRecords } from "./daily-records";
import { drawMaturitySection } from "./maturity-section";
import { CAUTION, DANGER, Layout, MUTED, PAGE, RULE, toneColour } from "./pdf-layout";

export const reportDateSchema = z
  .string({ error: "Add ?date= with a date such as 2026-11-17" })
  .refine(isLocalDate, { error: "The date must be a real calendar date written like 2026-11-17" });

const CHECKLIST_TITLES: Record<string, string> = { readiness: "Readiness", "hot-weather": "Hot weather", "cold-weather": "Cold weather" };
const ANSWERS: Record<string, string> = { yes: "Yes", no: "No", na: "N/A" };
const THUMB = { width: 120, height: 90, perRow: 4 };

/** A bounded thumbnail embedded in the PDF (lib/reports/thumbnails.ts), or why there is none. */
async function embedThumbnail(l: Layout, bytes: Uint8Array, opts: Parameters<typeof thumbnail>[1]): Promise<PDFImage | string> {
  const thumb = await thumbnail(bytes, opts);
  if (!thumb.ok) return thumb.reason;
  return thumb.format === "jpeg" ? l.doc.embedJpg(thumb.bytes) : l.doc.embedPng(thumb.bytes);
}

function dataUrlBytes(url: string | null): { bytes: Buffer; type: string } | null {
  const m = url?.match(/^data:(image\/[a-z+]+);base64,(.+)$/i);
  return m ? { bytes: Buffer.from(m[2], "base64"), type: m[1] } : null;
}

export async function buildDailyReport(access: ProjectAccess, rawDate: string | null): Promise<{ pdf: Uint8Array; filename: string }> {
  const projectId = access.project.id;
  const date = parseOrThrow(reportDateSchema, rawDate ?? undefined);
  permit(access, "project.read");

  const day = await loadDigestDay(projectId, date);
  const summary = summarizeDay(day);
  const { project } = day;
  const units = project.unitSystem;
  const time = (d: Date) => formatInstant(d, project.timeZone, "time");
  const dateTime = (d: Date) => formatInstant(d, project.timeZone, "yearDayTime");

  const { dayEnd, lists, items, dayPhotos, maturity, signatures } = await loadReportRecords(projectId, date, project.timeZone, day);
  const l = await Layout.create();
  l.doc.setTitle(`Daily report · ${project.name} · ${date}`);
  l.doc.setSubject(`${project.name} (${project.code}), ${summary.dateLong}`);
  l.doc.setProducer("Placewright");
  l.doc.setCreationDate(new Date());

  // Header
  l.text("DAILY PLACEMENT REPORT", { size: 8, bold: true, color: MUTED, gap: 4 });
  l.text(project.name, { size: 18, bold: true, gap: 4 });
  l.text(`${project.code} · ${summary.dateLong} · ${date}`, { size: 10, gap: 2 });
  l.text(`Times in ${project.timeZone}. Generated ${dateTime(new Date())} by ${access.user.name ?? access.user.email}.`, { size: 7, color: MUTED, gap: 6 });
  if (summary.isEmpty) l.text("Nothing was recorded for this project on this date.", { size: 10, color: CAUTION, gap: 4 });

  // Weather
  l.heading("Weather");
  if (!day.weather.length) l.text("No weather readings were recorded.", { color: MUTED });
  else {
    l.row(["Time", "Air", "Humidity", "Wind", "Concrete", "Evaporation", "Placement"], [0.1, 0.12, 0.11, 0.12, 0.12, 0.2, 0.23], { bold: true, color: MUTED });
    for (const w of day.weather) {
      const placement = w.placementId ? [...day.placements, ...day.otherPlacements].find((p) => p.id === w.placementId)?.element : "";
      l.row(
        [
          time(w.observedAt),
          formatTemperature(w.airTempC, units),
          `${Math.round(w.relativeHumidityPct)} %`,
          formatSpeed(w.windKmh, units),
          w.concreteTempC === null ? "-" : formatTemperature(w.concreteTempC, units),
          w.evaporationKgM2H === null ? "-" : `${formatEvaporation(w.evaporationKgM2H, units)}${w.concreteTempC === null ? " (est.)" : ""}`,
          placement ?? "",
        ],
        [0.1, 0.12, 0.11, 0.12, 0.12, 0.2, 0.23],
      );
    }
  }
  if (summary.diary?.weatherSummary) l.text(`Diary: ${summary.diary.weatherSummary}`, { color: MUTED });

  // Warnings, before the detail: what the office must look at.
  l.heading(`Warnings (${summary.warnings.length})`);
  if (!summary.warnings.length) l.text("No warnings for the day.", { color: MUTED });
  for (const w of summary.warnings) {
    const word = warningWord(w);
    l.text(`${word.label}: ${w.title}${w.context ? ` (${w.context})` : ""}`, { bold: true, color: toneColour(word.tone), gap: 1 });
    l.text(w.message, { indent: 12, gap: 1 });
    l.text(`Rule: ${citation(w.source)}`, { indent: 12, size: 7, color: MUTED, gap: 4 });
  }
  if (summary.warnings.length) {
    l.text(GOVERNS, { size: 7, color: MUTED, gap: 2 });
  }

  // Placements with their trucks and tests
  l.heading(`Placements (${summary.placements.length})`);
  if (!summary.placements.length) l.text("No placements were planned for this date.", { color: MUTED });
  day.placements.forEach((p, i) => {
    const line = summary.placements[i];
    l.need(60);
    const state = wordFor("placement", line.state);
    l.text(`${line.element}  ·  ${state.label}`, { size: 10, bold: true, color: toneColour(state.tone), gap: 2 });
    l.text(`${line.where || "No level or grid"} · start ${line.start} · ${line.volume}`, { gap: 1 });
    l.text(line.signed, { color: MUTED, gap: 2 });
    if (line.holdReason) l.text(`${state.label}: ${line.holdReason}`, { color: toneColour(state.tone), gap: 2 });

    const trucks = day.deliveries.filter((d) => d.placementId === p.id);
    const lines = summary.trucks.lines.filter((_, j) => day.deliveries[j].placementId === p.id);
    if (trucks.length) {
      l.row(["Truck", "Volume", "Times", "Notes"], [0.22, 0.09, 0.45, 0.24], { bold: true, color: MUTED });
      lines.forEach((t) => {
        const notes = [t.late ? "Late" : null, t.rejected ? `${DELIVERY_STATUS_WORDS.rejected.label}: ${t.rejected}` : null, t.water].filter(Boolean).join("; ");
        l.row([t.ticket, t.volume, t.times, notes || "-"], [0.22, 0.09, 0.45, 0.24], { color: t.rejected ? toneColour(DELIVERY_STATUS_WORDS.rejected.tone) : t.late ? DANGER : undefined });
      });
    } else l.text("No trucks recorded.", { color: MUTED });
    l.y -= 4;

    const tests = day.fieldTests.filter((t) => t.placementId === p.id);
    if (tests.length) {
      l.row(["Test time", "Slump", "Air", "Concrete temp.", "Ticket"], [0.16, 0.16, 0.12, 0.2, 0.36], { bold: true, color: MUTED });
      for (const t of tests) {
        const ticket = day.deliveries.find((d) => d.id === t.deliveryId)?.ticketNumber;
        l.row(
          [
            time(t.sampledAt),
            t.slumpMm === null ? "-" : formatLength(t.slumpMm, units, units === "SI" ? 0 : 1),
            t.airPct === null ? "-" : `${t.airPct.toFixed(1)} %`,
            t.concreteTempC === null ? "-" : formatTemperature(t.concreteTempC, units),
            ticket ? `Ticket ${ticket}` : "-",
          ],
          [0.16, 0.16, 0.12, 0.2, 0.36],
        );
      }
    } else l.text("No field tests recorded.", { color: MUTED });
    l.y -= 6;
  });
  // Trucks, tests and breaks of the day that belong to earlier placements.
  const elsewhere = summary.trucks.lines.filter((_, j) => !day.placements.some((p) => p.id === day.deliveries[j].placementId));
  if (elsewhere.length) {
    l.text("Trucks for earlier placements", { bold: true, gap: 2 });
    for (const t of elsewhere) l.text(`${t.ticket} · ${t.placement} · ${t.volume} · ${t.times}${t.rejected ? ` · REJECTED: ${t.rejected}` : ""}`);
  }
  if (summary.specimens.length || summary.breaks.length) {
    l.heading("Specimens and breaks");
    for (const s of summary.specimens) l.text(s);
    for (const b of summary.breaks) l.text(b.text, { color: b.low ? DANGER : undefined, bold: b.low });
  }

  // In-place strength at the end of the day (or now, for today's report).
  drawMaturitySection(l, maturity, new Date(Math.min(Date.now(), dayEnd.getTime())));

  // Checklists
  l.heading("Checklists");
  if (!lists.length) l.text("No checklists were recorded for the day's placements.", { color: MUTED });
  for (const c of lists) {
    const element = day.placements.find((p) => p.id === c.placementId)?.element ?? "";
    const mine = items.filter((i) => i.item.checklistId === c.id).map((i) => i.item);
    const answered = mine.filter((i) => i.answer).length;
    l.text(`${CHECKLIST_TITLES[c.kind] ?? c.kind} · ${element} · ${answered} of ${mine.length} answered`, { bold: true, gap: 2 });
    for (const i of mine) {
      l.row([i.label, i.answer ? ANSWERS[i.answer] : "Not answered", i.note ?? ""], [0.55, 0.13, 0.32], { color: i.answer === "no" ? CAUTION : i.answer ? undefined : MUTED });
    }
    l.y -= 4;
  }

  drawSiteStatus(l, summary.site);

  // Diary
  l.heading("Diary");
  if (!summary.diary) l.text("No diary was written for this date.", { color: CAUTION });
  else {
    const d = summary.diary;
    l.text(d.submitted ? "Submitted" : "Draft, not submitted", { color: d.submitted ? MUTED : CAUTION, gap: 2 });
    l.text(`Work done: ${d.workDone || "-"}`, { gap: 2 });
    l.text(`Crew: ${d.crewTotal ? `${d.crewTotal} (${d.crew})` : "-"}`, { gap: 2 });
    l.text(`Delays: ${d.delays.length ? d.delays.join("; ") : "none"}`, { gap: 2 });
  }

  // Photos: bounded thumbnails of the stored photos, at most MAX_REPORT_PHOTOS; others are listed by caption.
  l.heading(`Photos (${summary.photos.length})`);
  if (!summary.photos.length) l.text("No stored photos for this date.", { color: MUTED });
  let col = 0;
  const skipped: string[] = [];
  for (const p of dayPhotos.slice(0, MAX_REPORT_PHOTOS)) {
    let img: PDFImage | string;
    try {
      img = await embedThumbnail(l, await readObject(p.storageKey!), { maxPixels: MAX_PHOTO_PIXELS, widthPx: 360, heightPx: 270, format: "jpeg" });
    } catch {
      img = "the stored file could not be read"; // the object store is unreachable or the object is gone
    }
    const label = summary.photos.find((s) => s.id === p.id)?.label ?? p.caption;
    if (typeof img === "string") {
      skipped.push(`${label} (no thumbnail: ${img})`);
      continue;
    }
    if (col === 0) l.need(THUMB.height + 24);
    const scale = Math.min(THUMB.width / img.width, THUMB.height / img.height);
    const x = PAGE.margin + col * (THUMB.width + 12);
    // A frame of the thumbnail's box, so a pale photo still reads as one.
    l.page.drawRectangle({ x, y: l.y - THUMB.height, width: THUMB.width, height: THUMB.height, borderColor: RULE, borderWidth: 0.5 });
    const w = img.width * scale;
    const h = img.height * scale;
    l.page.drawImage(img, { x: x + (THUMB.width - w) / 2, y: l.y - (THUMB.height + h) / 2, width: w, height: h });
    const lines = l.wrap(label, THUMB.width, l.regular, 6);
    const caption = lines.length > 1 ? `${lines[0].replace(/.{0,3}$/, "")}...` : (lines[0] ?? "");
    l.page.drawText(caption, { x, y: l.y - THUMB.height - 9, size: 6, font: l.regular, color: MUTED });
    col += 1;
    if (col === THUMB.perRow) {
      col = 0;
      l.y -= THUMB.height + 16;
    }
  }
  if (col) l.y -= THUMB.height + 16;
  for (const s of skipped) l.text(s, { color: MUTED });
  if (dayPhotos.length > MAX_REPORT_PHOTOS) {
    l.text(`${dayPhotos.length - MAX_REPORT_PHOTOS} more photos are not drawn here; open the placement's photos in the app.`, { color: MUTED });
  }

  // Signatures
  l.heading("Signatures");
  if (!signatures.length) l.text("Nothing on this date has been signed.", { color: MUTED });
  for (const s of signatures) {
    const what = s.recordType === "placements" ? (day.placements.find((p) => p.id === s.recordId)?.element ?? "Placement") : "Diary";
    l.need(50);
    const top = l.y;
    l.text(`${what} · ${ROLE_LABELS[s.role]} · ${s.typedName}${s.signerName && s.signerName !== s.typedName ? ` (${s.signerName})` : ""}`, { bold: true, gap: 1 });
    l.text(`Signed ${dateTime(s.signedAt)} · signature check code ${s.hash.slice(0, 16)}`, { size: 7, color: MUTED, gap: 2 });
    const drawn = dataUrlBytes(s.image);
    const img = drawn ? await embedThumbnail(l, drawn.bytes, { maxPixels: MAX_SIGNATURE_PIXELS, widthPx: 420, heightPx: 120, format: "png" }) : null;
    if (img && typeof img !== "string") {
      const scale = Math.min(140 / img.width, 40 / img.height);
      l.page.drawImage(img, { x: PAGE.width - PAGE.margin - img.width * scale, y: top - img.height * scale, width: img.width * scale, height: img.height * scale });
      l.y = Math.min(l.y, top - img.height * scale) - 6;
    } else if (typeof img === "string") l.text(`Signature image not drawn: ${img}.`, { size: 7, color: MUTED, gap: 4 });
    else l.y -= 4;
  }

  l.footers(`${project.name} · daily report ${date}`);
  return { pdf: await l.doc.save(), filename: `daily-report-${project.code}-${date}.pdf`.replace(/[^A-Za-z0-9._-]/g, "_") };
}
