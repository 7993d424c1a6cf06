"use client";

import { useSyncExternalStore } from "react";

// A clock for "5 min ago" labels that re-renders every half minute, without calling Date.now() during
// render (0 on the server and during hydration: callers then show no relative time).
let now = 0;
const listeners = new Set<() => void>();
let timer: ReturnType<typeof setInterval> | null = null;

function subscribe(listener: () => void) {
  listeners.add(listener);
  if (!timer) {
    now = Date.now();
    timer = setInterval(() => {
      now = Date.now();
      for (const l of [...listeners]) l();
    }, 30_000);
    queueMicrotask(() => {
      for (const l of [...listeners]) l();
    });
  }
  return () => {
    listeners.delete(listener);
    if (listeners.size === 0 && timer) {
      clearInterval(timer);
      timer = null;
    }
  };
}

export function useNow(): number {
  return useSyncExternalStore(
    subscribe,
    () => now,
    () => 0,
  );
}
