// Bundles sw/sw.ts and injects the precache manifest. Runs after `next build` (see package.json).
// Static (prerendered) pages are the offline shells: their HTML is precached under their route, and
// their RSC payloads (.rsc and .segments/) are copied to public/__offline/ and precached too, so the
// service worker can answer the router's soft navigations offline (sw/rsc.ts).
import { cpSync, existsSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { build } from "esbuild";
import { injectManifest } from "workbox-build";
import { STATIC_SCRIPT_HASHES_FILE, inlineScriptHashes } from "../lib/http/security-headers.mjs";

const root = path.resolve(import.meta.dirname, "..");
const appDir = path.join(root, ".next/server/app");
const offlineDir = path.join(root, "public/__offline");
const tmp = path.join(root, ".next/sw-bundle.js");

// Prerendered pages: .next/server/app/<route>.html (route groups are already flattened).
function prerenderedPages(dir, prefix = "") {
  const out = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) {
      if (!name.startsWith("(") && !name.startsWith("[") && !name.startsWith("_") && name !== "api" && !name.endsWith(".segments")) {
        out.push(...prerenderedPages(full, `${prefix}/${name}`));
      }
    } else if (name.endsWith(".html") && !name.startsWith("_")) {
      const stem = name.replace(/\.html$/, "");
      const route = stem === "index" && prefix === "" ? "/" : `${prefix}/${stem}`;
      out.push({ html: full, stem: path.join(dir, stem), route });
    }
  }
  return out;
}

const pages = existsSync(appDir) ? prerenderedPages(appDir) : [];
rmSync(offlineDir, { recursive: true, force: true });
for (const page of pages) {
  const target = path.join(offlineDir, page.route === "/" ? "index" : page.route.slice(1));
  mkdirSync(path.dirname(target), { recursive: true });
  if (existsSync(`${page.stem}.rsc`)) cpSync(`${page.stem}.rsc`, `${target}.rsc`);
  if (existsSync(`${page.stem}.segments`)) cpSync(`${page.stem}.segments`, `${target}.segments`, { recursive: true });
}
const shells = pages.map((p) => p.route);
// The prerendered pages carry no nonce: proxy.ts gives each the hashes of its own inline scripts.
const hashes = Object.fromEntries(pages.map((p) => [p.route, inlineScriptHashes(readFileSync(p.html, "utf8"))]));
writeFileSync(path.join(root, ".next", STATIC_SCRIPT_HASHES_FILE), JSON.stringify(hashes));

await build({
  entryPoints: [path.join(root, "sw/sw.ts")],
  bundle: true,
  format: "iife",
  target: "es2020",
  minify: true,
  outfile: tmp,
  define: { "process.env.NODE_ENV": '"production"', OFFLINE_SHELLS: JSON.stringify(shells) },
  logLevel: "warning",
});

const nextDir = path.join(root, ".next");
const routeByFile = new Map(pages.map((p) => [path.relative(nextDir, p.html), p.route]));

const { count, size, warnings } = await injectManifest({
  swSrc: tmp,
  swDest: path.join(root, "public/sw.js"),
  globDirectory: root,
  globPatterns: [
    ".next/static/**/*.{js,css,woff2,png,svg}",
    "public/__offline/**/*.rsc",
    "public/icons/*.png",
    ...pages.map((p) => path.relative(root, p.html)),
  ],
  globIgnores: [".next/static/**/*.map"],
  maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
  manifestTransforms: [
    (entries) => ({
      manifest: entries.map((e) => {
        const fromNext = e.url.startsWith(".next/") ? e.url.slice(".next/".length) : null;
        if (fromNext && routeByFile.has(fromNext)) return { ...e, url: routeByFile.get(fromNext) };
        if (fromNext) return { ...e, url: `/_next/${fromNext}` };
        return { ...e, url: `/${e.url.replace(/^public\//, "")}` };
      }),
      warnings: [],
    }),
  ],
});
for (const w of warnings) console.warn(w);
console.log(`service worker: ${count} files precached (${(size / 1024).toFixed(0)} KiB); offline shells: ${shells.join(" ")}`);
