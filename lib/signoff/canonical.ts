import { createHash } from "node:crypto";

/**
 * Canonical JSON: object keys sorted at every depth, dates as ISO 8601 UTC, undefined dropped,
 * numbers as JSON writes them. The same content always gives the same text, whatever order the
 * database returned the columns or rows in.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(normalize(value));
}

function normalize(value: unknown): unknown {
  if (value instanceof Date) return value.toISOString();
  if (Array.isArray(value)) return value.map(normalize);
  if (value && typeof value === "object") {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const v = (value as Record<string, unknown>)[key];
      if (v !== undefined) out[key] = normalize(v);
    }
    return out;
  }
  if (typeof value === "number" && !Number.isFinite(value)) return null;
  return value;
}

export const sha256Hex = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");
