// Bundles sw/sw.ts and injects the precache manifest. Runs after `next build` (see package.json).
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { build } from "esbuild";
import { injectManifest } from "workbox-build";

const root = path.resolve(import.meta.dirname, "..");
const appDir = path.join(root, ".next/server/app");
const tmp = path.join(root, ".next/sw-bundle.js");

await build({
  entryPoints: [path.join(root, "sw/sw.ts")],
  bundle: true,
  format: "iife",
  target: "es2020",
  minify: true,
  outfile: tmp,
  define: { "process.env.NODE_ENV": '"production"' },
  logLevel: "warning",
});

// Prerendered (static) pages: .next/server/app/<route>.html is served at /<route>.
function prerenderedPages(dir, prefix = "") {
  const out = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) {
      if (!name.startsWith("(") && !name.startsWith("[") && name !== "api") out.push(...prerenderedPages(full, `${prefix}/${name}`));
      else if (name.startsWith("(")) out.push(...prerenderedPages(full, prefix));
    } else if (name.endsWith(".html") && !name.startsWith("_")) {
      const route = `${prefix}/${name.replace(/\.html$/, "")}`.replace(/\/index$/, "/");
      out.push({ file: path.relative(path.join(root, ".next"), full), route });
    }
  }
  return out;
}
const pages = existsSync(appDir) ? prerenderedPages(appDir) : [];
const pageByFile = new Map(pages.map((p) => [p.file, p.route]));

const { count, size, warnings } = await injectManifest({
  swSrc: tmp,
  swDest: path.join(root, "public/sw.js"),
  globDirectory: path.join(root, ".next"),
  globPatterns: ["static/**/*.{js,css,woff2,png,svg}", ...pages.map((p) => p.file)],
  globIgnores: ["static/**/*.map"],
  maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
  manifestTransforms: [
    (entries) => ({
      manifest: entries.map((e) => {
        const route = pageByFile.get(e.url);
        if (route) return { ...e, url: route };
        return { ...e, url: e.url.startsWith("static/") ? `/_next/${e.url}` : e.url };
      }),
      warnings: [],
    }),
  ],
});
for (const w of warnings) console.warn(w);
console.log(`service worker: ${count} files precached (${(size / 1024).toFixed(0)} KiB), pages: ${pages.map((p) => p.route).join(" ")}`);
