import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", ".data/**", "node_modules/**", "public/sw.js", "public/__offline/**", "drizzle/**", "next-env.d.ts", ".stryker-tmp/**", "reports/**"],
  },
];

export default config;
