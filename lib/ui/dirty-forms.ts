"use client";

import { useEffect, useSyncExternalStore } from "react";

// Which forms on the page hold unsaved input. The app-update prompt waits until none does, so a
// reload never throws away what someone is typing.
const dirty = new Set<string>();
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((l) => l());

export function setFormDirty(formId: string, isDirty: boolean): void {
  const had = dirty.has(formId);
  if (isDirty) dirty.add(formId);
  else dirty.delete(formId);
  if (had !== isDirty) emit();
}

/** Call in every form: `useDirtyGuard("delivery-form", formState.isDirty)`. */
export function useDirtyGuard(formId: string, isDirty: boolean): void {
  useEffect(() => {
    setFormDirty(formId, isDirty);
    return () => setFormDirty(formId, false);
  }, [formId, isDirty]);
}

export function useAnyFormDirty(): boolean {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => dirty.size > 0,
    () => false,
  );
}
