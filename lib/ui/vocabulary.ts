// What people read for every state and severity: one word, one colour and one icon for each, used
// by the field screens, the office screens, the digest e-mail and the PDF. The codes stored in the
// database (planned, ready, …) never reach a person; these words do. Pure: no React, no server code.
import type { Severity } from "@/lib/checks/types";
import type { ElementType, FindingSeverity, FindingState, PlacementState, SiteVisitState } from "@/lib/records/enums";
import { paletteHex, type PaletteToken } from "./palette";

/**
 * The colour families a state may take. Amber (caution) and red (danger) are for things that need
 * attention; the accent (progress, done) for work moving on as planned; ink for waiting or neutral.
 * `className` (a pill or box) and `textClass` (words alone) are the same choice as Tailwind classes;
 * a unit test checks they name these tokens.
 */
export const TONES = {
  neutral: { border: "ink-300", bg: "white", text: "ink-800", className: "border-ink-300 bg-white text-ink-800", textClass: "text-ink-800" },
  progress: { border: "lichen-600", bg: "white", text: "lichen-800", className: "border-lichen-600 bg-white text-lichen-800", textClass: "text-lichen-800" },
  done: { border: "lichen-700", bg: "lichen-50", text: "lichen-900", className: "border-lichen-700 bg-lichen-50 text-lichen-900", textClass: "text-lichen-900" },
  caution: { border: "caution-600", bg: "caution-50", text: "caution-800", className: "border-caution-600 bg-caution-50 text-caution-800", textClass: "text-caution-800" },
  danger: { border: "danger-600", bg: "danger-50", text: "danger-800", className: "border-danger-600 bg-danger-50 text-danger-800", textClass: "text-danger-800" },
} as const satisfies Record<string, { border: PaletteToken; bg: PaletteToken; text: PaletteToken; className: string; textClass: string }>;
export type Tone = keyof typeof TONES;

/** Hex values of a tone, for the e-mail's inline styles and the PDF. */
export function toneHex(tone: Tone): { border: string; bg: string; text: string } {
  const t = TONES[tone];
  return { border: paletteHex(t.border), bg: paletteHex(t.bg), text: paletteHex(t.text) };
}

/**
 * Icons by name (the names of the app's icon set, drawn by components/ui/state-badge.tsx). The
 * e-mail cannot load icons, so each has a plain text symbol too (HTML entity, safe in any client).
 */
export const ICON_SYMBOLS = {
  clock: "&#9675;", // ○
  "clipboard-check": "&#9745;", // ☑
  "circle-check": "&#10003;", // ✓
  truck: "&#9656;", // ▸
  hammer: "&#9679;", // ●
  "shield-check": "&#10004;", // ✔
  "octagon-pause": "&#8856;", // ⊘
  "circle-x": "&#10005;", // ✕
  "circle-alert": "&#9888;", // ⚠
  "triangle-alert": "&#9888;", // ⚠
  "octagon-alert": "&#9888;", // ⚠
  info: "&#8226;", // •
  reply: "&#8617;", // ↩
  "pencil-line": "&#9998;", // ✎
  send: "&#8599;", // ↗
  "file-x": "&#10005;", // ✕
  scale: "&#9878;", // ⚖
} as const;
export type IconName = keyof typeof ICON_SYMBOLS;

/** `phrase`: how a sentence says the state ("This visit report is a draft") where the label would read oddly. */
export type Word = { label: string; tone: Tone; icon: IconName; phrase?: string };

export const PLACEMENT_STATE_WORDS: Record<PlacementState, Word> = {
  planned: { label: "Planned", tone: "neutral", icon: "clock" },
  ready: { label: "Ready for inspection", tone: "progress", icon: "clipboard-check" },
  cleared: { label: "Cleared to place", tone: "progress", icon: "circle-check" },
  placing: { label: "Placing", tone: "progress", icon: "truck" },
  placed: { label: "Placed", tone: "done", icon: "hammer" },
  signed: { label: "Signed", tone: "done", icon: "shield-check" },
  // A hold stops the work: red with a stop sign and the word, on every surface.
  held: { label: "Held", tone: "danger", icon: "octagon-pause" },
};

export const SITE_VISIT_STATE_WORDS: Record<SiteVisitState, Word> = {
  draft: { label: "Draft", tone: "neutral", icon: "pencil-line", phrase: "a draft" },
  submitted: { label: "Submitted", tone: "progress", icon: "send" },
  signed: { label: "Signed", tone: "done", icon: "shield-check" },
};

export const FINDING_STATE_WORDS: Record<FindingState, Word> = {
  open: { label: "Open", tone: "caution", icon: "circle-alert" },
  answered: { label: "Correction reported", tone: "progress", icon: "reply", phrase: "waiting for its correction to be checked" },
  closed: { label: "Closed", tone: "done", icon: "circle-check" },
};

export const FINDING_SEVERITY_WORDS: Record<FindingSeverity, Word> = {
  minor: { label: "Minor", tone: "neutral", icon: "info" },
  major: { label: "Major", tone: "caution", icon: "triangle-alert" },
  critical: { label: "Critical", tone: "danger", icon: "octagon-alert" },
};

/** The rulebook's severities (lib/checks): note it, watch it, act on it. */
export const SEVERITY_WORDS: Record<Severity, Word> = {
  info: { label: "Note", tone: "neutral", icon: "info" },
  caution: { label: "Caution", tone: "caution", icon: "triangle-alert" },
  warning: { label: "Warning", tone: "danger", icon: "octagon-alert" },
};

export const DELIVERY_STATUS_WORDS: Record<"accepted" | "rejected", Word> = {
  accepted: { label: "Accepted", tone: "neutral", icon: "truck" },
  rejected: { label: "Rejected", tone: "danger", icon: "circle-x" },
};

/** A project-day's diary as the office sees it (a work day with no diary is "missing"). */
export const DIARY_STATE_WORDS: Record<"missing" | "draft" | "submitted", Word> = {
  missing: { label: "Missing", tone: "danger", icon: "file-x" },
  draft: { label: "Draft", tone: "caution", icon: "pencil-line" },
  submitted: { label: "Submitted", tone: "done", icon: "send" },
};

/** A planned cylinder test in the lab's queue. */
export const LAB_DUE_WORDS: Record<"due" | "overdue" | "tested", Word> = {
  due: { label: "Due", tone: "neutral", icon: "clock" },
  overdue: { label: "Overdue", tone: "danger", icon: "octagon-alert" },
  tested: { label: "Tested", tone: "done", icon: "circle-check" },
};

export const VOCABULARY = {
  placement: PLACEMENT_STATE_WORDS,
  "site-visit": SITE_VISIT_STATE_WORDS,
  finding: FINDING_STATE_WORDS,
  "finding-severity": FINDING_SEVERITY_WORDS,
  severity: SEVERITY_WORDS,
  delivery: DELIVERY_STATUS_WORDS,
  diary: DIARY_STATE_WORDS,
  "lab-due": LAB_DUE_WORDS,
} as const;
export type VocabularyKind = keyof typeof VOCABULARY;

/** The text colour class of a state (a hold reason written in the hold's colour). */
export const textClassOf = (kind: VocabularyKind, code: string) => TONES[wordFor(kind, code).tone].textClass;

/** The field tab and links for changes made in two places that someone must reconcile. */
export const RECONCILE_WORDS = { label: "To reconcile", icon: "scale" } as const satisfies { label: string; icon: IconName };

/** The word for a stored code; an unknown code (a newer server) is shown as itself, in neutral. */
export function wordFor(kind: VocabularyKind, code: string): Word {
  const words = VOCABULARY[kind] as Record<string, Word>;
  return Object.hasOwn(words, code) ? words[code] : { label: code, tone: "neutral", icon: "info" };
}

export const placementStateLabel = (state: string) => wordFor("placement", state).label;

/** A state as it reads after "is": its phrase, or its label in lower case ("ready for inspection"). */
export function statePhrase(kind: VocabularyKind, state: string): string {
  const word = wordFor(kind, state);
  return word.phrase ?? word.label.toLowerCase();
}

/** The button and the phrase for a move into a state ("Ask for inspection" / "ask for inspection"). */
export type MoveWords = { button: string; phrase: string };

export const PLACEMENT_MOVE_WORDS: Record<PlacementState, MoveWords> = {
  planned: { button: "Back to planned", phrase: "take it back to planned" },
  ready: { button: "Ask for inspection", phrase: "ask for inspection" },
  cleared: { button: "Clear to place", phrase: "clear it to place" },
  placing: { button: "Start placing", phrase: "start placing" },
  placed: { button: "Mark placed", phrase: "mark it placed" },
  signed: { button: "Sign off", phrase: "sign it off" },
  held: { button: "Hold", phrase: "hold it" },
};

export const FINDING_MOVE_WORDS: Record<FindingState, MoveWords> = {
  answered: { button: "Report the correction", phrase: "report the correction" },
  closed: { button: "Close", phrase: "close it" },
  open: { button: "Reopen", phrase: "reopen it" },
};

export const SITE_VISIT_MOVE_WORDS: Record<SiteVisitState, MoveWords> = {
  submitted: { button: "Submit the report", phrase: "submit it" },
  draft: { button: "Back to draft", phrase: "take it back to draft" },
  signed: { button: "Sign off", phrase: "sign it off" },
};

/**
 * "This placement is ready for inspection. Next: the inspector can clear it to place or hold it;
 * the superintendent can take it back to planned." Who may act comes from the caller (the
 * permission table); this only puts it in words. With `viewer` (the reader's role on the project)
 * the reader's own moves come first and are said to them: "You can clear it to place or hold it;
 * the superintendent can take it back to planned." A reader who cannot act is told so.
 */
export function describeNextSteps(
  noun: string,
  statePhrase: string,
  steps: { roles: readonly string[]; phrases: readonly string[] }[],
  whenNone: string,
  viewer?: string | null,
): string {
  const now = `This ${noun} is ${statePhrase}.`;
  if (steps.length === 0) return `${now} ${whenNone}`;
  const others = (list: typeof steps) => list.map((s) => `the ${s.roles.filter((r) => r !== viewer).join(" or the ")} can ${s.phrases.join(" or ")}`);
  if (viewer === undefined) return `${now} Next: ${others(steps).join("; ")}.`;
  const mine = steps.filter((s) => viewer !== null && s.roles.includes(viewer));
  const rest = steps.filter((s) => !mine.includes(s));
  if (mine.length === 0) return `${now} Nothing for you to do here; ${others(rest).join("; ")}.`;
  const yours = `You can ${mine.flatMap((s) => s.phrases).join(" or ")}`;
  return `${now} ${[yours, ...others(rest)].join("; ")}.`;
}

/**
 * The word of a warning, whether it carries the rulebook's severity or the older digest tone
 * ("danger" reads as Warning, "caution" as Caution), so every surface says it the same way.
 */
export function severityOf(w: { severity?: Severity; tone?: "danger" | "caution" }): Severity {
  return w.severity ?? (w.tone === "danger" ? "warning" : "caution");
}
export const warningWord = (w: { severity?: Severity; tone?: "danger" | "caution" }): Word => SEVERITY_WORDS[severityOf(w)];

/** The kind of structural element, as a person says it (the stored code never reaches a screen). */
export const ELEMENT_TYPE_LABELS: Record<ElementType, string> = {
  footing: "Footing",
  wall: "Wall",
  column: "Column",
  beam: "Beam",
  "slab-on-ground": "Slab on ground",
  "elevated-slab": "Elevated slab",
  other: "Other",
};

/** The label of a stored element type; an unknown code reads "Other" rather than the code. */
export const elementTypeLabel = (code: unknown): string => ELEMENT_TYPE_LABELS[String(code) as ElementType] ?? ELEMENT_TYPE_LABELS.other;

/** How a specimen set was cured, for the set's choice and the calibration's points (maturity method). */
export const curingBasisLabel = (loggerName: string | null): string => (loggerName ? `Cured with the set: ${loggerName}` : "Standard curing");
