import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import { layerZones, nextFreeLib, placewrightPlugin } from "./eslint/layers.mjs";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", ".data/**", "node_modules/**", "public/sw.js", "public/__offline/**", "drizzle/**", "next-env.d.ts", ".stryker-tmp/**", "reports/**"],
  },
  // Imports run one way (DEVELOPERS.md "Layers"): no cycles, and the zones of eslint/layers.mjs.
  {
    files: ["**/*.{ts,tsx,mts}"],
    plugins: { placewright: placewrightPlugin },
    rules: {
      "import/no-cycle": ["error", { ignoreExternal: true }],
      "import/no-restricted-paths": ["error", { zones: layerZones }],
      "placewright/client-no-db": "error",
    },
  },
  nextFreeLib,
];

export default config;
