import type { Config } from "tailwindcss";

// Placewright palette: a cool ink/slate base and one accent ("lichen", a blue-green).
// Amber and red are reserved for warnings and are always paired with words and an icon.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
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
