// Messages between the import screen and its worker, and the one function that answers them (run in
// the worker, or on the page when the worker cannot start).
import { guessColumns, parseCsv, readRows, toBatches, type BadRow, type CsvTable, type ImportOptions } from "@/lib/maturity/csv-import";

export type WorkerAsk = { type: "open"; file: File } | { type: "check"; options: ImportOptions };
export type WorkerAnswer =
  | { type: "opened"; head: string[][]; lines: number; guess: { timeColumn: number; tempColumn: number; firstDataLine: number } }
  | { type: "checked"; count: number; firstAt: string | null; lastAt: string | null; bad: BadRow[]; badCount: number; batches: [string, number][][] }
  | { type: "failed"; message: string };

/** Answers one ask; `state.table` keeps the parsed file between the preview and the check. */
export async function answer(ask: WorkerAsk, state: { table: CsvTable | null }): Promise<WorkerAnswer> {
  try {
    if (ask.type === "open") {
      state.table = parseCsv(await ask.file.text());
      return { type: "opened", head: state.table.rows.slice(0, 8), lines: state.table.rows.length, guess: guessColumns(state.table.rows) };
    }
    if (!state.table) return { type: "failed", message: "Choose the file again." };
    const result = readRows(state.table, ask.options);
    return {
      type: "checked",
      count: result.readings.length,
      firstAt: result.readings[0]?.[0].toISOString() ?? null,
      lastAt: result.readings.at(-1)?.[0].toISOString() ?? null,
      bad: result.bad.slice(0, 200),
      badCount: result.bad.length,
      batches: toBatches(result.readings),
    };
  } catch (error) {
    return { type: "failed", message: error instanceof Error ? error.message : "The file could not be read." };
  }
}
