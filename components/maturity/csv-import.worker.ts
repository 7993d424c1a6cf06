/// <reference lib="webworker" />
// Reads a logger's CSV off the page's thread, so a 100,000-row file never freezes the screen.
// The parsed file stays here between the preview and the check; nothing is stored by the worker.
import { guessColumns, parseCsv, readRows, toBatches, type CsvTable, type ImportOptions } from "@/lib/maturity/csv-import";
import type { WorkerAnswer, WorkerAsk } from "./csv-import-protocol";

let table: CsvTable | null = null;
const post = (answer: WorkerAnswer) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(answer);

self.onmessage = async (event: MessageEvent<WorkerAsk>) => {
  try {
    const ask = event.data;
    if (ask.type === "open") {
      table = parseCsv(await ask.file.text());
      post({ type: "opened", head: table.rows.slice(0, 8), lines: table.rows.length, guess: guessColumns(table.rows) });
    } else if (ask.type === "check") {
      if (!table) throw new Error("Choose the file again.");
      const result = readRows(table, ask.options as ImportOptions);
      post({
        type: "checked",
        count: result.readings.length,
        firstAt: result.readings[0]?.[0].toISOString() ?? null,
        lastAt: result.readings.at(-1)?.[0].toISOString() ?? null,
        bad: result.bad.slice(0, 200),
        badCount: result.bad.length,
        batches: toBatches(result.readings),
      });
    }
  } catch (error) {
    post({ type: "failed", message: error instanceof Error ? error.message : "The file could not be read." });
  }
};
