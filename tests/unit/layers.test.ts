// The import rules of eslint.config.mjs (eslint/layers.mjs) fire on a deliberate violation of each
// layer, through ESLint's own Node API on source text placed at a real path of the tree
// [common practice: a lint rule is tested by linting a known-bad snippet].
import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { ESLint } from "eslint";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
let eslint: ESLint;

// The cycle rule reads its graph from disk, so its case is two files written for the test.
const fixtureDir = path.join(root, "components", "__layers-fixture__");

beforeAll(() => {
  eslint = new ESLint({ cwd: root });
});
afterAll(() => rmSync(fixtureDir, { recursive: true, force: true }));

/** The rules a snippet breaks, linted as if it were `file` (an existing file: the cycle rule reads the tree). */
async function ruleIds(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result.messages.map((m) => m.ruleId ?? m.message);
}

describe("import direction (eslint/layers.mjs)", { timeout: 300_000 }, () => {
  it("refuses a cycle: two modules importing each other", async () => {
    mkdirSync(fixtureDir, { recursive: true });
    writeFileSync(path.join(fixtureDir, "menu.ts"), 'import { shell } from "./shell";\nexport const menu = () => shell;\n');
    writeFileSync(path.join(fixtureDir, "shell.ts"), 'import { menu } from "./menu";\nexport const shell = () => menu;\n');
    const [result] = await eslint.lintFiles([path.join(fixtureDir, "menu.ts")]);
    expect(result.messages.map((m) => m.ruleId)).toContain("import/no-cycle");
  });

  it("keeps lib/concrete and lib/checks free of the app (only lib/concrete and lib/time)", async () => {
    expect(await ruleIds("lib/concrete/units.ts", 'import { getRecordDef } from "@/lib/records/registry";\nexport const x = getRecordDef;\n')).toContain("import/no-restricted-paths");
    expect(await ruleIds("lib/checks/weather.ts", 'import { db } from "@/db";\nexport const x = db;\n')).toContain("import/no-restricted-paths");
    expect(await ruleIds("lib/checks/weather.ts", 'import { cToF } from "@/lib/concrete/units";\nimport { zonedParts } from "@/lib/time/zone";\nexport const x = [cToF, zonedParts];\n')).toEqual([]);
  });

  it("keeps Next and components out of lib, except the HTTP adapter (lib/api)", async () => {
    expect(await ruleIds("lib/records/types.ts", 'import { NextResponse } from "next/server";\nexport const x = NextResponse;\n')).toContain("no-restricted-imports");
    expect(await ruleIds("lib/records/types.ts", 'import { Button } from "@/components/ui/button";\nexport const x = Button;\n')).toContain("import/no-restricted-paths");
    expect(await ruleIds("lib/api/request.ts", 'import { NextResponse } from "next/server";\nexport const x = NextResponse;\n')).toEqual([]);
  });

  it("keeps lib out of db (db/index.ts may read lib/config only)", async () => {
    expect(await ruleIds("db/schema/placements.ts", 'import { PLACEMENT_STATES } from "@/lib/records/enums";\nexport const x = PLACEMENT_STATES;\n')).toContain("import/no-restricted-paths");
    expect(await ruleIds("db/json-rows.ts", 'import { logger } from "../lib/log";\nexport const x = logger;\n')).toContain("import/no-restricted-paths");
    expect(await ruleIds("db/index.ts", 'import { logger } from "@/lib/log";\nexport const x = logger;\n')).toContain("import/no-restricted-paths");
  });

  it("keeps db out of client components", async () => {
    const client = '"use client";\nimport { db } from "@/db";\nexport const x = db;\n';
    expect(await ruleIds("components/ui/notice.tsx", client)).toContain("placewright/client-no-db");
    expect(await ruleIds("components/ui/notice.tsx", client.replace('"use client";\n', ""))).not.toContain("placewright/client-no-db");
  });
});
