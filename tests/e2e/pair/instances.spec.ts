// Two instances behind the proxy serve the same build, honour each other's sessions and count sign-in throttling together.
import { createHash, randomUUID } from "node:crypto";
import { expect, test } from "@playwright/test";
import { A, B, PROXY, signIn } from "./support";

test.describe.configure({ mode: "serial" });

test("requests alternate between both instances, which serve the same service worker and assets", async () => {
  const servedBy = new Set<string>();
  for (let i = 0; i < 4; i++) servedBy.add((await fetch(`${PROXY}/api/health/live`)).headers.get("x-served-by") ?? "");
  expect(servedBy.size, "round robin over two instances").toBe(2);

  // Same build: the service worker (with its precache manifest and revisions) is byte-identical.
  const sha = async (url: string) => createHash("sha256").update(Buffer.from(await (await fetch(url)).arrayBuffer())).digest("hex");
  const [swA, swB] = [await sha(`${A}/sw.js`), await sha(`${B}/sw.js`)];
  expect(swA).toBe(swB);
  const sw = await (await fetch(`${A}/sw.js`)).text();
  const asset = sw.match(/"(\/_next\/static\/[^"]+\.js)"/)?.[1];
  expect(asset, "the precache lists the build's assets").toBeTruthy();
  expect(await sha(`${A}${asset}`)).toBe(await sha(`${B}${asset}`));

  // Readiness and liveness on each instance; /api/health stays as it was for older callers.
  for (const base of [A, B]) {
    const ready = await fetch(`${base}/api/health/ready`);
    expect(ready.status).toBe(200);
    expect(await ready.json()).toMatchObject({ ready: true, checks: { shutdown: "running", database: "ready", migrations: "applied" } });
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
  }
});

test("a session from one instance is honoured by the other", async () => {
  const { cookie } = await signIn(A, A, "sam.super@example.test", "placewright-demo");
  expect(cookie).toBeTruthy();
  const res = await fetch(`${B}/api/projects`, { headers: { cookie: cookie! } });
  expect(res.status).toBe(200);
  expect(((await res.json()) as { name: string }[]).length).toBeGreaterThan(0);
});

test("sign-in throttling counts wrong passwords across both instances", async () => {
  test.setTimeout(120_000);
  const lockedAfter = async (email: string, bases: string[]) => {
    for (let attempt = 1; attempt <= 20; attempt++) {
      const base = bases[attempt % bases.length];
      const { error } = await signIn(base, base, email, "not-the-password");
      if (error && /Too many wrong passwords/.test(error)) return attempt;
    }
    return Infinity;
  };
  const single = await lockedAfter(`throttle-one-${randomUUID().slice(0, 8)}@example.test`, [A]);
  const alternating = await lockedAfter(`throttle-two-${randomUUID().slice(0, 8)}@example.test`, [A, B]);
  console.log(`sign-in locked after ${single} wrong passwords on one instance, ${alternating} alternating A/B`);
  expect(single).toBeLessThan(20);
  // A counter per process would need about twice as many attempts when they alternate.
  expect(alternating).toBe(single);
});
