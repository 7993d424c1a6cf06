"use client";

import { Sun } from "lucide-react";
import { useSyncExternalStore } from "react";

const EVENT = "pw-contrast-change";

function subscribe(callback: () => void) {
  window.addEventListener(EVENT, callback);
  return () => window.removeEventListener(EVENT, callback);
}

const isDaylight = () => document.documentElement.dataset.contrast === "daylight";

/** Daylight mode: black on white, heavier borders, for direct sun. Remembered on the device. */
export function ContrastToggle() {
  const daylight = useSyncExternalStore(subscribe, isDaylight, () => false);

  const toggle = () => {
    const next = !daylight;
    if (next) document.documentElement.dataset.contrast = "daylight";
    else delete document.documentElement.dataset.contrast;
    try {
      localStorage.setItem("pw-contrast", next ? "daylight" : "normal");
    } catch {
      // Private mode: the choice lasts for this page only.
    }
    window.dispatchEvent(new Event(EVENT));
  };

  return (
    <button
      type="button"
      onClick={toggle}
      aria-pressed={daylight}
      title="Daylight mode (high contrast)"
      className="inline-flex min-h-11 min-w-11 items-center justify-center rounded-md text-ink-100 hover:bg-white/10"
    >
      <Sun className="h-5 w-5" aria-hidden="true" />
      <span className="sr-only">Daylight mode</span>
    </button>
  );
}
