// The vocabulary of states and severities: every state has a word, a colour of the palette and an
// icon; the colours of the e-mail and the PDF are the palette's; the words are readable and plain.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import tailwindConfig from "@/tailwind.config";
import { ICONS } from "@/components/ui/state-badge";
import { SEVERITIES } from "@/lib/checks/types";
import type { DueStatus } from "@/lib/lab/due";
import { describeAllowed } from "@/lib/placements/workflow";
import { DELIVERY_STATUSES, FINDING_SEVERITIES, FINDING_STATES, PLACEMENT_STATES, SITE_VISIT_STATES } from "@/lib/records/enums";
import { describeMoves } from "@/lib/site-visits/lifecycle";
import { PALETTE, paletteHex, paletteRgb } from "@/lib/ui/palette";
import { ICON_SYMBOLS, TONES, toneHex, VOCABULARY, warningWord, wordFor, type Tone, type VocabularyKind } from "@/lib/ui/vocabulary";

const CODES: Record<VocabularyKind, readonly string[]> = {
  placement: PLACEMENT_STATES,
  "site-visit": SITE_VISIT_STATES,
  finding: FINDING_STATES,
  "finding-severity": FINDING_SEVERITIES,
  severity: SEVERITIES,
  delivery: DELIVERY_STATUSES,
  diary: ["missing", "draft", "submitted"],
  "lab-due": ["due", "overdue", "tested"] satisfies DueStatus[],
};

const allPaletteHexes = new Set(
  Object.values(PALETTE).flatMap((v): string[] => (typeof v === "string" ? [v] : Object.values(v))),
);

// WCAG 2.1, definitions of "relative luminance" and "contrast ratio" (sRGB, 0.03928 threshold).
function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2];
}
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe("every state and severity has a word, a palette colour and an icon", () => {
  for (const [kind, codes] of Object.entries(CODES) as [VocabularyKind, readonly string[]][]) {
    it(`${kind}: ${codes.join(", ")}`, () => {
      expect(Object.keys(VOCABULARY[kind]).sort()).toEqual([...codes].sort());
      for (const code of codes) {
        const word = wordFor(kind, code);
        expect(word.label.trim().length, `${kind} ${code}`).toBeGreaterThan(1);
        expect(Object.keys(TONES)).toContain(word.tone);
        expect(Object.keys(ICON_SYMBOLS)).toContain(word.icon);
        for (const hex of Object.values(toneHex(word.tone))) expect(allPaletteHexes.has(hex), `${kind} ${code} ${hex}`).toBe(true);
      }
    });
  }

  it("an unknown code (from a newer server) shows as itself in neutral, never as another state", () => {
    expect(wordFor("placement", "poured")).toEqual({ label: "poured", tone: "neutral", icon: "info" });
    expect(wordFor("placement", "toString").label).toBe("toString");
  });

  it("every icon name has a drawn icon on screen and a text symbol in the e-mail", () => {
    expect(Object.keys(ICONS).sort()).toEqual(Object.keys(ICON_SYMBOLS).sort());
    for (const symbol of Object.values(ICON_SYMBOLS)) expect(symbol).toMatch(/^&#\d+;$/);
  });
});

describe("the colours come from the palette, the one definition", () => {
  it("tailwind.config.ts reads the palette (the classes and the hexes cannot drift)", () => {
    const colors = (tailwindConfig.theme?.extend as { colors: Record<string, unknown> }).colors;
    expect(colors).toEqual({ ink: PALETTE.ink, lichen: PALETTE.lichen, caution: PALETTE.caution, danger: PALETTE.danger });
  });

  it("each tone's Tailwind classes name the same palette tokens as its hexes", () => {
    for (const [tone, t] of Object.entries(TONES)) {
      expect(t.className.split(" ").sort(), tone).toEqual([`border-${t.border}`, `bg-${t.bg}`, `text-${t.text}`].sort());
      expect(t.textClass).toBe(`text-${t.text}`);
      expect(toneHex(tone as Tone)).toEqual({ border: paletteHex(t.border), bg: paletteHex(t.bg), text: paletteHex(t.text) });
    }
  });

  it("paletteHex and paletteRgb read the palette and refuse a name outside it", () => {
    expect(paletteHex("caution-600")).toBe(PALETTE.caution[600]);
    expect(paletteRgb("white")).toEqual({ r: 1, g: 1, b: 1 });
    expect(paletteRgb("ink-950")).toEqual({ r: 0x0c / 255, g: 0x11 / 255, b: 0x18 / 255 });
    // @ts-expect-error: not a palette token
    expect(() => paletteHex("caution-300")).toThrow(/not a colour of the palette/);
  });

  it("the contrast formula gives WCAG's published extremes", () => {
    expect(contrast("#000000", "#ffffff")).toBeCloseTo(21, 5); // WCAG 2.1: contrast ratios range from 1 to 21
    expect(contrast("#767676", "#ffffff")).toBeCloseTo(4.54, 2); // [common practice] the lightest grey passing AA on white
  });

  it("every label is readable on its own background and on white (WCAG 2.1 SC 1.4.3, 4.5:1 for text)", () => {
    for (const tone of Object.keys(TONES) as Tone[]) {
      const { text, bg } = toneHex(tone);
      expect(contrast(text, bg), tone).toBeGreaterThanOrEqual(4.5);
      expect(contrast(text, PALETTE.white), tone).toBeGreaterThanOrEqual(4.5);
    }
  });
});

describe("one meaning, one look", () => {
  it("held stops the work: the danger tone with a stop-sign icon, like a warning", () => {
    expect(wordFor("placement", "held")).toEqual({ label: "Held", tone: "danger", icon: "octagon-pause" });
    expect(wordFor("placement", "held").tone).toBe(wordFor("severity", "warning").tone);
  });

  it("a rejected truck is the danger tone, as a warning is", () => {
    expect(wordFor("delivery", "rejected").tone).toBe("danger");
  });

  it("amber and red mean attention: no state that is work going to plan uses them [PRODUCT.md look and feel]", () => {
    for (const code of ["planned", "ready", "cleared", "placing", "placed", "signed"]) expect(["caution", "danger"]).not.toContain(wordFor("placement", code).tone);
  });

  it("a warning and a caution are said in words, from either the rulebook's severity or the digest's tone", () => {
    expect(warningWord({ severity: "warning" }).label).toBe("Warning");
    expect(warningWord({ tone: "danger" }).label).toBe("Warning");
    expect(warningWord({ tone: "caution" }).label).toBe("Caution");
    expect(warningWord({ severity: "info" }).label).toBe("Note");
  });
});

describe("our own plain words (issue 15, item 11)", () => {
  it("names the states in words that say what happens next", () => {
    expect(wordFor("placement", "ready").label).toBe("Ready for inspection");
    expect(wordFor("finding", "answered").label).toBe("Correction reported");
  });

  it("says what can happen next without raw state codes", () => {
    for (const state of PLACEMENT_STATES) expect(describeAllowed(state)).not.toMatch(/can go to:|\(\w+\)/);
    expect(describeMoves("findings", "answered")).toBe("This finding is waiting for its correction to be checked. Next: the inspector can close it or reopen it.");
    expect(describeMoves("site-visits", "submitted")).toMatch(/^This visit report is submitted\. Next: the inspector can take it back to draft; it is signed through the sign-off\.$/);
  });

  // Issue 17 item 9: the hint says what the reader can do next, in the permission table's terms
  // (lib/auth/can.ts), never the state machine's codes [common practice: plain-language UI text].
  it("says to the reader what they can do next, and who else can act", () => {
    expect(describeAllowed("ready", "inspector")).toBe(
      "This placement is ready for inspection. You can clear it to place or hold it; the superintendent can take it back to planned.",
    );
    expect(describeAllowed("held", "superintendent")).toBe("This placement is held. You can ask for inspection.");
    expect(describeAllowed("held", "owner")).toBe("This placement is held. Nothing for you to do here; the superintendent can ask for inspection.");
    expect(describeAllowed("held", null)).toBe("This placement is held. Nothing for you to do here; the superintendent can ask for inspection.");
    expect(describeMoves("findings", "open", "superintendent")).toBe("This finding is open. You can report the correction; the inspector can close it.");
    expect(describeMoves("findings", "answered", "superintendent")).toBe("This finding is waiting for its correction to be checked. Nothing for you to do here; the inspector can close it or reopen it.");
    expect(describeMoves("site-visits", "draft", "inspector")).toBe("This visit report is a draft. You can submit it.");
    for (const state of PLACEMENT_STATES) for (const role of ["superintendent", "inspector", "office", "owner"] as const) {
      expect(describeAllowed(state, role)).not.toMatch(/can go to:|\((superintendent|inspector|office|owner)\)/);
    }
  });

  it("no other file keeps its own copy of the state words or the palette's hexes", () => {
    const roots = ["app", "components", "lib"];
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = path.join(dir, name);
        if (statSync(p).isDirectory()) walk(p);
        else if (/\.(ts|tsx)$/.test(name)) files.push(p);
      }
    };
    roots.forEach(walk);
    const home = new Set([path.join("lib", "ui", "vocabulary.ts"), path.join("lib", "ui", "palette.ts")]);
    const offenders = files
      .filter((f) => !home.has(f))
      .filter((f) => {
        const s = readFileSync(f, "utf8");
        return (
          /Ready for review|"Answered"|"Tests out"|Save the day|content hash|"!!"/.test(s) ||
          /\b(held|ready|answered|rejected):\s*"[A-Z]/.test(s) ||
          [...allPaletteHexes].filter((h) => h !== PALETTE.white).some((h) => s.toLowerCase().includes(`"${h}"`))
        );
      });
    expect(offenders).toEqual([]);
  });
});

describe("element types read as words, never the stored code (issue 17 item 9)", () => {
  it("every element type has a capitalised label without hyphens; an unknown code reads Other", async () => {
    const { ELEMENT_TYPES } = await import("@/lib/records/enums");
    const { ELEMENT_TYPE_LABELS, elementTypeLabel } = await import("@/lib/ui/vocabulary");
    for (const t of ELEMENT_TYPES) {
      expect(ELEMENT_TYPE_LABELS[t]).toMatch(/^[A-Z][a-z ]+$/);
      expect(elementTypeLabel(t)).not.toContain("-");
    }
    expect(elementTypeLabel("elevated-slab")).toBe("Elevated slab");
    expect(elementTypeLabel("no-such-kind")).toBe("Other");
  });
});
