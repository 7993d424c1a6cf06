// A small flowing layout over pdf-lib: wrapped text, headings, column rows and images, with new
// pages as the cursor runs out. Fonts are the app's own IBM Plex Mono, from the .woff files of
// @fontsource/ibm-plex-mono. The app's IBM Plex Sans (@fontsource-variable) ships only WOFF2, which
// @pdf-lib/fontkit cannot read; and @pdf-lib/fontkit 1.1.1 fails on these WOFF 1.0 files too
// ("Trying to access beyond buffer length" while reading glyph boxes), so woff.ts unpacks them to
// plain TrueType first, which it embeds and subsets correctly.
import { readFileSync } from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { paletteRgb, type PaletteToken } from "@/lib/ui/palette";
import { TONES, type Tone } from "@/lib/ui/vocabulary";
import { woffToSfnt } from "./woff";

const FONT_DIR = path.join(process.cwd(), "node_modules/@fontsource/ibm-plex-mono/files");
const fontFile = (weight: 400 | 600) => woffToSfnt(readFileSync(path.join(FONT_DIR, `ibm-plex-mono-latin-${weight}-normal.woff`)));

export const PAGE = { width: 612, height: 792, margin: 40 }; // US Letter, points
// Colours from the app's palette (lib/ui/palette.ts), so the PDF matches the screens and the e-mail.
const colour = (token: PaletteToken) => {
  const { r, g, b } = paletteRgb(token);
  return rgb(r, g, b);
};
/** The text colour of a state's or a severity's tone (lib/ui/vocabulary.ts). */
export const toneColour = (tone: Tone) => colour(TONES[tone].text);
export const INK = colour("ink-900");
export const MUTED = colour("ink-600");
export const DANGER = toneColour("danger");
export const CAUTION = toneColour("caution");
export const ACCENT = colour("lichen-700");
export const RULE = colour("ink-200");

type Style = { size?: number; bold?: boolean; color?: ReturnType<typeof rgb>; indent?: number; gap?: number };

export class Layout {
  doc!: PDFDocument;
  regular!: PDFFont;
  bold!: PDFFont;
  page!: PDFPage;
  y = 0;
  private charset = new Set<number>();

  static async create(): Promise<Layout> {
    const l = new Layout();
    l.doc = await PDFDocument.create();
    l.doc.registerFontkit(fontkit);
    l.regular = await l.doc.embedFont(fontFile(400), { subset: true });
    l.bold = await l.doc.embedFont(fontFile(600), { subset: true });
    l.charset = new Set(l.regular.getCharacterSet());
    l.newPage();
    return l;
  }

  get contentWidth() {
    return PAGE.width - 2 * PAGE.margin;
  }

  newPage() {
    this.page = this.doc.addPage([PAGE.width, PAGE.height]);
    this.y = PAGE.height - PAGE.margin;
  }

  /** Room for `h` points, or a new page. */
  need(h: number) {
    if (this.y - h < PAGE.margin + 20) this.newPage();
  }

  /** Characters the font lacks become close equivalents, never an empty box. */
  clean(text: string): string {
    const swap: Record<string, string> = { "≥": ">=", "≤": "<=", "−": "-", "×": "x", "’": "'", "‘": "'", "“": '"', "”": '"', "…": "...", "→": "->", "±": "+/-" };
    return [...text.replace(/\s+/g, " ")].map((ch) => (this.charset.has(ch.codePointAt(0)!) ? ch : (swap[ch] ?? "?"))).join("");
  }

  wrap(text: string, width: number, font: PDFFont, size: number): string[] {
    const words = this.clean(text).split(" ");
    const lines: string[] = [];
    let line = "";
    for (const word of words) {
      const next = line ? `${line} ${word}` : word;
      if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
      else {
        lines.push(line);
        line = word;
      }
    }
    if (line) lines.push(line);
    // A single word wider than the column is cut, not drawn over the margin.
    return lines.map((l) => {
      let s = l;
      while (s.length > 1 && font.widthOfTextAtSize(s, size) > width) s = s.slice(0, -1);
      return s;
    });
  }

  text(text: string, { size = 9, bold = false, color = INK, indent = 0, gap = 2 }: Style = {}) {
    const font = bold ? this.bold : this.regular;
    const lines = this.wrap(text, this.contentWidth - indent, font, size);
    for (const line of lines) {
      this.need(size + gap);
      this.y -= size;
      this.page.drawText(line, { x: PAGE.margin + indent, y: this.y, size, font, color });
      this.y -= gap;
    }
  }

  heading(text: string) {
    this.need(40);
    this.y -= 10;
    this.text(text, { size: 12, bold: true, color: ACCENT, gap: 3 });
    this.page.drawLine({ start: { x: PAGE.margin, y: this.y }, end: { x: PAGE.width - PAGE.margin, y: this.y }, thickness: 0.6, color: RULE });
    this.y -= 5;
  }

  /** One row of columns at fixed fractions of the width; cells wrap inside their column. */
  row(cells: string[], fractions: number[], { size = 8, bold = false, color = INK }: Style = {}) {
    const font = bold ? this.bold : this.regular;
    const widths = fractions.map((f) => f * this.contentWidth);
    const wrapped = cells.map((c, i) => this.wrap(c, widths[i] - 4, font, size));
    const lines = Math.max(1, ...wrapped.map((w) => w.length));
    const h = lines * (size + 2) + 2;
    this.need(h);
    let x = PAGE.margin;
    wrapped.forEach((cell, i) => {
      cell.forEach((line, j) => this.page.drawText(line, { x, y: this.y - size - j * (size + 2), size, font, color }));
      x += widths[i];
    });
    this.y -= h;
  }

  /** Footer on every page: what the report is and the page number. */
  footers(label: string) {
    const pages = this.doc.getPages();
    pages.forEach((p, i) => {
      const text = this.clean(`${label} · page ${i + 1} of ${pages.length}`);
      p.drawText(text, { x: PAGE.margin, y: PAGE.margin - 16, size: 7, font: this.regular, color: MUTED });
    });
  }
}
