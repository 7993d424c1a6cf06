// The digest's HTML part: table layout and inline styles, which is what mail programs render
// reliably. Colours, words and symbols from lib/ui/vocabulary.ts (the same as on the screens and in
// the PDF); warnings and states carry a word and a symbol, never colour alone.
import { citation, type Finding } from "@/lib/checks";
import { paletteHex } from "@/lib/ui/palette";
import { DELIVERY_STATUS_WORDS, ICON_SYMBOLS, toneHex, warningWord, wordFor, type Word } from "@/lib/ui/vocabulary";
import type { DigestSummary } from "./summary";

export type DigestLinks = { day: string; photo: (id: string) => string; preferences: string; unsubscribe: string | null };

const C = {
  ink950: paletteHex("ink-950"),
  ink900: paletteHex("ink-900"),
  ink700: paletteHex("ink-700"),
  ink600: paletteHex("ink-600"),
  ink200: paletteHex("ink-200"),
  ink100: paletteHex("ink-100"),
  ink50: paletteHex("ink-50"),
  lichen700: paletteHex("lichen-700"),
  lichen100: paletteHex("lichen-100"),
};
const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;
const FONT = "-apple-system,'Segoe UI',Roboto,'Helvetica Neue',Arial,sans-serif";

export const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

const section = (title: string, body: string) =>
  `<tr><td class="pw-pad" style="padding:20px 28px 4px;border-top:1px solid ${C.ink100}">` +
  `<h2 style="margin:0 0 10px;font-size:17px;line-height:1.3;color:${C.ink950}">${esc(title)}</h2>${body}</td></tr>`;

const para = (html: string, extra = "") => `<p style="margin:0 0 10px;font-size:15px;line-height:1.5;color:${C.ink900};${extra}">${html}</p>`;
const muted = (text: string) => `<span style="color:${C.ink600}">${esc(text)}</span>`;

function stat(label: string, value: string, note = "") {
  return (
    `<div class="pw-stat" style="display:inline-block;vertical-align:top;box-sizing:border-box;width:23%;min-height:92px;margin:0 1% 8px;padding:12px 6px;text-align:center;background:${C.ink50};border:1px solid ${C.ink100};border-radius:8px">` +
    `<div style="font-size:22px;font-weight:700;line-height:1.2;color:${C.ink950}">${esc(value)}</div>` +
    `<div style="font-size:13px;line-height:1.35;color:${C.ink600};margin-top:2px">${esc(label)}${note ? `<br>${esc(note)}` : ""}</div></div>`
  );
}

function warningBox(w: Finding & { context: string }) {
  const word = warningWord(w);
  const tone = toneHex(word.tone);
  return (
    `<div data-rule="${w.rule}" data-severity="${w.severity}" data-subject="${esc(`${w.subject.type}:${w.subject.id}`)}" data-tone="${word.tone}" style="margin:0 0 10px;padding:12px 14px;border:2px solid ${tone.border};border-left-width:6px;border-radius:8px;background:${tone.bg};color:${tone.text}">` +
    `<div style="font-size:15px;font-weight:700;line-height:1.4">${ICON_SYMBOLS[word.icon]} ${word.label}: ${esc(w.title)}</div>` +
    (w.context ? `<div style="font-size:13px;line-height:1.4;color:${C.ink700}">${esc(w.context)}</div>` : "") +
    `<div style="font-size:14px;line-height:1.5;margin-top:4px;color:${C.ink900}">${esc(w.message)}</div>` +
    `<div style="font-size:13px;line-height:1.45;margin-top:6px;color:${C.ink700}"><strong>Rule:</strong> ${esc(citation(w.source))}. ${esc(w.governs)}</div></div>`
  );
}

/** A state as a pill: the vocabulary's word, symbol and colours (the screens' StateBadge). */
function badge(word: Word, code: string) {
  const t = toneHex(word.tone);
  return `<span data-state-badge="${esc(code)}" data-tone="${word.tone}" style="display:inline-block;padding:2px 10px;border:1px solid ${t.border};border-radius:999px;background:${t.bg};color:${t.text};font-size:13px;font-weight:700;white-space:nowrap">${ICON_SYMBOLS[word.icon]} <span data-part="label">${esc(word.label)}</span></span>`;
}

/** A word in its tone's text colour, with its symbol (a rejected truck, a late one, a low break). */
const flag = (word: Word, extra = "") => `<strong style="color:${toneHex(word.tone).text}">${ICON_SYMBOLS[word.icon]} ${esc(word.label)}${extra}</strong>`;

const item = (html: string) => `<li style="margin:0 0 8px;font-size:15px;line-height:1.5;color:${C.ink900}">${html}</li>`;
const list = (items: string[]) => `<ul style="margin:0 0 10px;padding-left:20px">${items.join("")}</ul>`;

function placementsHtml(s: DigestSummary) {
  if (s.placements.length === 0) return para("No placements today.", `font-weight:600`);
  return s.placements
    .map(
      (p) =>
        `<div style="margin:0 0 12px;padding:12px 14px;border:1px solid ${C.ink200};border-radius:8px">` +
        `<div style="font-size:16px;font-weight:700;color:${C.ink950};line-height:1.35">${esc(p.element)} ${badge(wordFor("placement", p.state), p.state)}</div>` +
        `<div style="font-size:14px;color:${C.ink600};margin-top:2px">${esc([p.where, `start ${p.start}`].filter(Boolean).join(" · "))}</div>` +
        `<div style="font-size:15px;color:${C.ink900};margin-top:6px">${esc(p.volume)}</div>` +
        `<div style="font-size:14px;color:${C.ink700};margin-top:2px">${esc(p.signed)}</div>` +
        (p.holdReason ? `<div style="font-size:14px;color:${toneHex(wordFor("placement", p.state).tone).text};margin-top:4px"><strong>${esc(p.stateLabel)}:</strong> ${esc(p.holdReason)}</div>` : "") +
        `</div>`,
    )
    .join("");
}

function trucksHtml(s: DigestSummary) {
  const t = s.trucks;
  const head = para(
    `${t.accepted} accepted, ${esc(t.volume)} delivered` +
      (t.rejected ? `; <strong>${t.rejected} rejected</strong>` : "") +
      (t.late ? `; <strong>${t.late} late</strong>` : "") +
      (t.waterAdded ? `; <strong>${esc(t.waterAdded)} water added at site</strong>` : ""),
  );
  const rows = t.lines.map((l) =>
    item(
      `<strong>${esc(l.ticket)}</strong> · ${esc(l.volume)}${l.placement ? ` · ${muted(l.placement)}` : ""}<br>` +
        `<span style="font-size:14px">${esc(l.times)}</span>` +
        (l.late ? ` ${flag({ ...warningWord({ severity: "warning" }), label: "Late" })}` : "") +
        (l.water ? `<br>${flag({ ...warningWord({ severity: "caution" }), label: l.water })}` : "") +
        (l.rejected ? `<br>${flag(DELIVERY_STATUS_WORDS.rejected, ":")} ${esc(l.rejected)}` : ""),
    ),
  );
  return head + list(rows);
}

export function renderHtml(s: DigestSummary, subject: string, links: DigestLinks): string {
  const warnCount = s.warnings.length;
  const body: string[] = [];
  if (s.placements.length || s.trucks.lines.length) {
    body.push(
      `<tr><td class="pw-pad pw-stats" style="padding:16px 22px 8px;font-size:0">` +
        stat("placements", String(s.placements.length)) +
        stat("delivered", s.trucks.volume, `${s.trucks.accepted} trucks`) +
        stat("tests", String(s.tests.total), s.tests.outOfTolerance ? `${s.tests.outOfTolerance} out of tolerance` : "") +
        stat("warnings", String(warnCount)) +
        `</td></tr>`,
    );
  }
  if (warnCount) body.push(section("Needs attention", s.warnings.map(warningBox).join("")));
  body.push(section("Placements", placementsHtml(s)));
  const site = s.site;
  if (site.holds.length) {
    const held = wordFor("placement", "held");
    body.push(section(`${held.label} (${site.holds.length})`, list(site.holds.map((h) => item(`${flag(held, `: ${h.element}`)} ${esc(h.reason)}`)))));
  }
  if (site.openFindings.length) {
    body.push(
      section(
        `Open findings of site visits (${site.openFindings.length})`,
        list(site.openFindings.map((f) => item(f.severity === "minor" ? esc(f.text) : flag({ ...wordFor("finding-severity", f.severity), label: f.text })))),
      ),
    );
  }
  if (site.safetyNotes) body.push(section("Safety notes", para(esc(site.safetyNotes))));
  if (s.trucks.lines.length) body.push(section("Trucks", trucksHtml(s)));
  if (s.tests.total) {
    const text = s.tests.outOfTolerance ? `${s.tests.total} field tests; ${s.tests.outOfTolerance} out of tolerance (see above).` : `${s.tests.total} field tests, all within tolerance.`;
    body.push(section("Field tests", para(esc(text))));
  }
  if (s.weather.readings) body.push(section("Weather", para(esc(`${plural(s.weather.readings, "reading")}; air ${s.weather.airRange}.`))));
  if (s.specimens.length || s.breaks.length) {
    const breaks = s.breaks.map((b) => item(b.low ? flag({ ...warningWord({ severity: "warning" }), label: b.text }) : esc(b.text)));
    body.push(
      section(
        "Specimens and breaks",
        (s.specimens.length ? para("<strong>Made today</strong>", "margin-bottom:4px") + list(s.specimens.map((x) => item(esc(x)))) : "") +
          (breaks.length ? para("<strong>Breaks received</strong>", "margin-bottom:4px") + list(breaks) : ""),
      ),
    );
  }
  if (s.diary) {
    const d = s.diary;
    body.push(
      section(
        "Diary",
        para(`<strong>Crew on site: ${d.crewTotal}</strong>${d.crew ? ` ${muted(`(${d.crew})`)}` : ""}`) +
          (d.weatherSummary ? para(`Weather: ${esc(d.weatherSummary)}`) : "") +
          (d.workDone ? para(esc(d.workDone)) : "") +
          (d.delays.length ? para("<strong>Delays</strong>", "margin-bottom:4px") + list(d.delays.map((x) => item(esc(x)))) : para("No delays recorded.")) +
          (d.submitted ? "" : para(muted("The superintendent has not submitted this diary yet."))),
      ),
    );
  }
  if (s.photos.length) {
    const tiles = s.photos
      .map(
        (p) =>
          `<a href="${esc(links.photo(p.id))}" style="display:inline-block;margin:0 8px 8px 0;padding:10px 12px;border:1px solid ${C.ink200};border-radius:8px;background:${C.ink50};color:${C.lichen700};font-size:14px;font-weight:600;text-decoration:none">${esc(p.label)} &#8599;</a>`,
      )
      .join("");
    body.push(section("Photos", tiles + para(muted("Photos open in Placewright after you sign in."), "font-size:13px")));
  }
  body.push(
    `<tr><td class="pw-pad" style="padding:20px 28px;border-top:1px solid ${C.ink100}">` +
      `<a href="${esc(links.day)}" style="display:inline-block;background:${C.lichen700};color:#ffffff;text-decoration:none;padding:14px 22px;border-radius:8px;font-size:16px;font-weight:700">Open the day in Placewright</a></td></tr>`,
  );
  const footer =
    `The checks above apply published defaults; the project's specifications, local codes and the engineer of record govern. ` +
    `You receive this because you are on the digest list of ${s.projectName}.`;
  return (
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">` +
    `<meta name="color-scheme" content="light"><title>${esc(subject)}</title>` +
    `<style>@media (max-width:520px){.pw-pad{padding-left:16px!important;padding-right:16px!important}.pw-stats{padding-left:10px!important;padding-right:10px!important}.pw-stat{width:48%!important}}</style></head>` +
    `<body style="margin:0;padding:0;background:${C.ink100};font-family:${FONT}">` +
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${C.ink100}"><tr><td align="center" style="padding:20px 8px">` +
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:640px;background:#ffffff;border:1px solid ${C.ink200};border-radius:12px;font-family:${FONT}">` +
    `<tr><td class="pw-pad" style="background:${C.ink900};padding:20px 28px;border-radius:12px 12px 0 0">` +
    `<div style="font-size:13px;font-weight:700;letter-spacing:.08em;text-transform:uppercase;color:${C.lichen100}">Placewright · Daily digest</div>` +
    `<div style="font-size:24px;font-weight:700;line-height:1.25;color:#ffffff;margin-top:4px">${esc(s.projectName)}</div>` +
    `<div style="font-size:15px;color:${C.ink200};margin-top:2px">${esc(s.dateLong)} · ${esc(s.projectCode)}</div></td></tr>` +
    body.join("") +
    `<tr><td class="pw-pad" style="padding:16px 28px 20px;background:${C.ink50};border-top:1px solid ${C.ink100};border-radius:0 0 12px 12px;font-size:13px;line-height:1.5;color:${C.ink600}">` +
    `${esc(footer)}<br><a href="${esc(links.preferences)}" style="color:${C.lichen700}">Change the hour or empty-day setting</a>` +
    (links.unsubscribe ? ` · <a href="${esc(links.unsubscribe)}" style="color:${C.lichen700}" data-link="unsubscribe">Unsubscribe</a>` : "") +
    `</td></tr></table></td></tr></table></body></html>`
  );
}

/** The whole message for a day with nothing recorded: one line, the link, the way out. */
export function renderEmptyHtml(s: DigestSummary, subject: string, links: DigestLinks): string {
  return (
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(subject)}</title></head>` +
    `<body style="margin:0;padding:20px 12px;background:${C.ink100};font-family:${FONT}">` +
    `<div style="max-width:640px;margin:0 auto;padding:20px 24px;background:#ffffff;border:1px solid ${C.ink200};border-radius:12px">` +
    `<p style="margin:0;font-size:16px;line-height:1.5;color:${C.ink900}"><strong>${esc(s.projectName)}</strong>, ${esc(s.dateLong)}: No placements today. ` +
    `<a href="${esc(links.day)}" style="color:${C.lichen700}">Open the day</a></p>` +
    `<p style="margin:12px 0 0;font-size:13px;color:${C.ink600}"><a href="${esc(links.preferences)}" style="color:${C.lichen700}">Stop empty-day messages</a>` +
    (links.unsubscribe ? ` · <a href="${esc(links.unsubscribe)}" style="color:${C.lichen700}" data-link="unsubscribe">Unsubscribe</a>` : "") +
    `</p></div></body></html>`
  );
}
