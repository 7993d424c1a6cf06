// The Placewright palette: a cool ink/slate base and one accent ("lichen", a blue-green). Amber
// ("caution") and red ("danger") are reserved for warnings and always come with words and an icon.
// This is the one definition of the colours: tailwind.config.ts builds the CSS classes from it, and
// the e-mail and the PDF read their hex values from it, so a colour cannot drift between surfaces.
// Pure data: no imports, so the Tailwind config, the server and the browser can all load it.

export const PALETTE = {
  ink: {
    50: "#f4f6f8",
    100: "#e6eaef",
    200: "#cdd5de",
    300: "#a9b6c4",
    400: "#7c8da0",
    500: "#5a6b7f",
    600: "#445466",
    700: "#354252",
    800: "#232d3a",
    900: "#161d27",
    950: "#0c1118",
  },
  lichen: {
    50: "#eefaf7",
    100: "#d3f1ea",
    200: "#a8e2d5",
    300: "#72cbba",
    400: "#3fae9b",
    500: "#23917f",
    600: "#187467",
    700: "#155d54",
    800: "#134a44",
    900: "#103d38",
  },
  caution: { 50: "#fff8e6", 100: "#fdecbf", 600: "#a86300", 700: "#8a5000", 800: "#6b3e00" },
  danger: { 50: "#fdf0ef", 100: "#f9d6d3", 600: "#b4231a", 700: "#951c15", 800: "#741510" },
  white: "#ffffff",
} as const;

export type PaletteFamily = Exclude<keyof typeof PALETTE, "white">;
/** A colour of the palette by name: "ink-300", "caution-600", "white". */
export type PaletteToken = "white" | { [F in PaletteFamily]: `${F}-${keyof (typeof PALETTE)[F] & number}` }[PaletteFamily];

/** The hex value of a palette token ("caution-600" → "#a86300"); throws on a name that is not in the palette. */
export function paletteHex(token: PaletteToken): string {
  if (token === "white") return PALETTE.white;
  const [family, shade] = token.split("-") as [PaletteFamily, string];
  const value = (PALETTE[family] as Record<string, string> | undefined)?.[shade];
  if (!value) throw new Error(`"${token}" is not a colour of the palette`);
  return value;
}

/** The same colour for pdf-lib: red, green and blue from 0 to 1. */
export function paletteRgb(token: PaletteToken): { r: number; g: number; b: number } {
  const hex = paletteHex(token);
  const n = (i: number) => parseInt(hex.slice(i, i + 2), 16) / 255;
  return { r: n(1), g: n(3), b: n(5) };
}
