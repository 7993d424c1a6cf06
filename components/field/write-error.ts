import { isLocalWriteError } from "@/lib/sync/client";

/** The message and field messages of a refused local write. */
export function writeErrorOf(error: unknown): { message: string; fields: Record<string, string> } {
  if (isLocalWriteError(error)) return { message: error.message, fields: error.fields ?? {} };
  return { message: error instanceof Error ? error.message : "Could not save on this device.", fields: {} };
}
