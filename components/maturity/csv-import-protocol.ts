// Messages between the import screen and its worker.
import type { BadRow, ImportOptions } from "@/lib/maturity/csv-import";

export type WorkerAsk = { type: "open"; file: File } | { type: "check"; options: ImportOptions };
export type WorkerAnswer =
  | { type: "opened"; head: string[][]; lines: number; guess: { timeColumn: number; tempColumn: number; firstDataLine: number } }
  | { type: "checked"; count: number; firstAt: string | null; lastAt: string | null; bad: BadRow[]; badCount: number; batches: [string, number][][] }
  | { type: "failed"; message: string };
