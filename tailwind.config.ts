import type { Config } from "tailwindcss";
import { PALETTE } from "./lib/ui/palette";

// The colours come from lib/ui/palette.ts, the one definition shared with the e-mail and the PDF.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/ui/**/*.ts"],
  theme: {
    extend: {
      colors: {
        ink: PALETTE.ink,
        lichen: PALETTE.lichen,
        caution: PALETTE.caution,
        danger: PALETTE.danger,
      },
      fontFamily: {
        sans: ["var(--font-plex-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-plex-mono)", "ui-monospace", "monospace"],
      },
      minHeight: { touch: "3rem" },
      minWidth: { touch: "3rem" },
    },
  },
};

export default config;
