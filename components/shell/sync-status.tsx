"use client";

import { Wifi, WifiOff } from "lucide-react";
import { useSyncExternalStore } from "react";

function subscribe(callback: () => void) {
  window.addEventListener("online", callback);
  window.addEventListener("offline", callback);
  return () => {
    window.removeEventListener("online", callback);
    window.removeEventListener("offline", callback);
  };
}

/** Connection state in words and an icon. The outbox counts join it when field sync lands. */
export function SyncStatus() {
  const online = useSyncExternalStore(subscribe, () => navigator.onLine, () => true);
  return (
    <span
      data-testid="sync-status"
      className={`inline-flex min-h-11 items-center gap-1.5 rounded-md px-2 text-sm font-semibold ${online ? "text-ink-100" : "bg-caution-100 text-caution-800"}`}
    >
      {online ? <Wifi className="h-4 w-4" aria-hidden="true" /> : <WifiOff className="h-4 w-4" aria-hidden="true" />}
      <span className="hidden sm:inline">{online ? "Online" : "Offline"}</span>
      <span className="sr-only sm:hidden">{online ? "Online" : "Offline"}</span>
    </span>
  );
}
