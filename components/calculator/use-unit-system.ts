"use client";

import { useCallback, useSyncExternalStore } from "react";
import type { UnitSystem } from "@/lib/concrete";

// The user's unit system on this device. Inch-pound until they choose, because the static page is
// prerendered without knowing the device; the saved choice takes over right after hydration.
const KEY = "pw-units";
const EVENT = "pw-units-change";
const DEFAULT: UnitSystem = "IP";

// Private mode or storage switched off: the choice lasts until the page closes.
let unsaved: UnitSystem | undefined;

function read(): UnitSystem {
  try {
    const saved = localStorage.getItem(KEY);
    if (saved === "SI" || saved === "IP") return saved;
  } catch {
    // fall through to the unsaved choice
  }
  return unsaved ?? DEFAULT;
}

function subscribe(callback: () => void) {
  window.addEventListener(EVENT, callback);
  // Another tab changing the choice.
  window.addEventListener("storage", callback);
  return () => {
    window.removeEventListener(EVENT, callback);
    window.removeEventListener("storage", callback);
  };
}

export function useUnitSystem(): [UnitSystem, (next: UnitSystem) => void] {
  const unitSystem = useSyncExternalStore(subscribe, read, () => DEFAULT);
  const choose = useCallback((next: UnitSystem) => {
    unsaved = next;
    try {
      localStorage.setItem(KEY, next);
    } catch {
      // kept in `unsaved`
    }
    window.dispatchEvent(new Event(EVENT));
  }, []);
  return [unitSystem, choose];
}

const noSubscription = () => () => {};

/** False during prerender and hydration, true once the page is interactive. */
export function useHydrated(): boolean {
  return useSyncExternalStore(noSubscription, () => true, () => false);
}
