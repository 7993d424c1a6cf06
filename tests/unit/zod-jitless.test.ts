// The root providers switch off zod's `new Function` fast path (the Content-Security-Policy forbids
// eval) without importing zod. Checked against zod's own API: `z.config()` returns the global config
// zod reads when it parses [zod 4 docs, z.config]; this fails if the providers stop setting it or a
// zod upgrade stops sharing that object through globalThis.
import { expect, it } from "vitest";

it("zod sees jitless set by the providers, through the one shared config object", async () => {
  await import("@/components/providers/providers");
  const { z } = await import("zod");
  expect(z.config().jitless).toBe(true);
  expect(z.config()).toBe((globalThis as { __zod_globalConfig?: unknown }).__zod_globalConfig);
});
