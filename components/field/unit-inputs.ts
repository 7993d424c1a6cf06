// Numbers typed in the project's units: conversion to and from SI happens here, at the edge of a form.
import { fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from "@/lib/concrete";

/** A typed number, or null when empty; NaN stays NaN so the schema names the field. */
export function parseNumber(text: string | undefined | null): number | null {
  if (text === undefined || text === null || text.trim() === "") return null;
  return Number(text.replace(",", "."));
}

/** Typed value in the project's units → SI (null when empty). */
export function toSI(quantity: Quantity, text: string | undefined, unitSystem: UnitSystem): number | null {
  const n = parseNumber(text);
  if (n === null || Number.isNaN(n)) return n;
  return fromDisplay(quantity, n, unitSystem);
}

/** Stored SI → text for an input in the project's units. */
export function fromSI(quantity: Quantity, value: unknown, unitSystem: UnitSystem, digits = 2): string {
  if (typeof value !== "number") return "";
  return String(Number(toDisplay(quantity, value, unitSystem).toFixed(digits)));
}

export { unitLabel };
