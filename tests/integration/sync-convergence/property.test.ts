// SYNC.md promises 1, 2 and 4 as a property (fast-check): two or three simulated devices edit one
// project offline and online in random interleavings, and sync through the real push and pull
// (lib/sync/server) against the real database. At quiescence:
//   (a) every device's copy equals the server's rows of the project (version, fields, tombstone);
//   (b) every mutation ever sent has exactly one stored row in sync_mutations, with the payload sent,
//       and its outcome is kept: applied (and the server row shows it, or a later applied change of
//       the same field), a conflict (the conflicts row holds the client payload), or rejected with a
//       message (a signed refusal also keeps the payload as a conflict);
//   (c) nothing is doubled: the project's rows are exactly the records whose create was applied.
// Reproduce a failure with the seed (and path) it reports: SYNC_PROPERTY_SEED=… SYNC_PROPERTY_PATH=…
import fc from "fast-check";
import { describe, it } from "vitest";
import { scenarioArb, stats } from "./simulation";
import { runScenario } from "./quiescence";

const SEED = Number(process.env.SYNC_PROPERTY_SEED ?? 1);
const PATH = process.env.SYNC_PROPERTY_PATH || undefined;
const NUM_RUNS = Number(process.env.SYNC_PROPERTY_RUNS ?? 20);

describe("sync convergence (property)", () => {
  it(`random offline/online edits on 2–3 devices converge and keep every payload (seed ${SEED})`, async () => {
    const started = Date.now();
    try {
      await fc.assert(fc.asyncProperty(scenarioArb, runScenario), {
        seed: SEED,
        path: PATH,
        numRuns: NUM_RUNS,
        // Shrinking re-runs scenarios against the database: bounded, then the smallest case so far is reported.
        interruptAfterTimeLimit: 90_000,
        markInterruptAsFailure: false,
      });
    } catch (error) {
      throw new Error(
        `sync convergence failed; reproduce with SYNC_PROPERTY_SEED=${SEED} (and SYNC_PROPERTY_PATH from the report)\n${(error as Error).message}`,
        { cause: error },
      );
    } finally {
      console.log(
        `sync convergence: seed ${SEED}, ${stats.runs} runs, ${stats.steps} steps, ${stats.mutations} mutations ` +
          `(${stats.applied} applied, ${stats.conflicts} conflicts, ${stats.rejected} rejected; ${stats.resolves} resolves), ` +
          `${stats.lostAnswers} lost answers, ${stats.transient} transient failures, ${stats.resent} mutations sent again, ` +
          `${((Date.now() - started) / 1000).toFixed(1)} s`,
      );
    }
  }, 150_000);
});
