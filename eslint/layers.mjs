// The direction of imports (app → components → lib → db), enforced by ESLint (eslint.config.mjs).
// Each zone names what it keeps out and why; tests/unit/layers.test.ts proves each one fires.

/** import/no-restricted-paths zones (paths resolved, so "@/…" and relative imports both count). */
export const layerZones = [
  {
    target: "./lib/concrete",
    from: "./lib",
    except: ["./concrete", "./time"],
    message: "lib/concrete is the formula library: it imports only lib/concrete and lib/time.",
  },
  {
    target: "./lib/checks",
    from: "./lib",
    except: ["./checks", "./concrete", "./time"],
    message: "lib/checks is the rulebook, run on the phone too: it imports only lib/checks, lib/concrete and lib/time.",
  },
  {
    target: ["./lib/concrete", "./lib/checks", "./lib/time"],
    from: ["./app", "./components", "./db", "./scripts", "./sw"],
    message: "Pure domain code imports nothing of the app.",
  },
  {
    target: "./lib",
    from: ["./app", "./components"],
    message: "lib never imports screens or routes: move the shared part into lib.",
  },
  {
    // db/index.ts reads its settings through lib/config (the one reader of the environment).
    target: ["./db/schema", "./db/!(index).ts"],
    from: "./lib",
    message: "db imports nothing of lib: value lists live in db/schema/enums.ts.",
  },
  {
    target: "./db/index.ts",
    from: "./lib",
    except: ["./config.ts"],
    message: "db imports nothing of lib except its settings (lib/config.ts).",
  },
];

/**
 * lib never imports Next. The HTTP adapter is the named exception: lib/api (route wrappers, the
 * request guard) and lib/auth/session.ts (reads the session cookie of a request, redirects a page).
 */
export const nextFreeLib = {
  files: ["lib/**/*.{ts,tsx}"],
  ignores: ["lib/api/**", "lib/auth/session.ts"],
  rules: {
    "no-restricted-imports": [
      "error",
      {
        patterns: [
          { regex: "^next(/.*)?$", message: "lib never imports Next; the HTTP adapter (lib/api) does." },
        ],
      },
    ],
  },
};

const importsDb = (source) => /^(@\/db|(\.\.\/)+db)(\/|$)/.test(source);

/** A client component ("use client") runs in the browser: it never imports the database layer. */
const clientNoDb = {
  meta: { type: "problem", schema: [], messages: { db: "A client component never imports db ({{source}}); use a lib module or pass the data in." } },
  create(context) {
    const body = context.sourceCode.ast.body;
    const isClient = body.some((node) => node.type === "ExpressionStatement" && node.directive === "use client");
    if (!isClient) return {};
    const check = (node) => {
      if (node.source && typeof node.source.value === "string" && importsDb(node.source.value)) {
        context.report({ node: node.source, messageId: "db", data: { source: node.source.value } });
      }
    };
    return { ImportDeclaration: check, ExportNamedDeclaration: check, ExportAllDeclaration: check, ImportExpression: check };
  },
};

export const placewrightPlugin = { rules: { "client-no-db": clientNoDb } };
