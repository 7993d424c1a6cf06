"use client";

import { useCallback, useEffect, useState } from "react";
import type { StoredIdentity } from "./db";
import { checkDevicePin, isUnlockedInTab, markUnlockedInTab, offlineAccess, type OfflineAccess, type PinCheck } from "./device-access";

/**
 * Whether the person remembered on this device may open their offline data now (device-access.ts),
 * and a PIN unlock for this tab. `stored` null (a live session, or nobody): nothing to decide.
 */
export function useOfflineAccess(stored: StoredIdentity | null): { access: OfflineAccess | null; unlock: (pin: string) => Promise<PinCheck> } {
  const [access, setAccess] = useState<OfflineAccess | null>(null);
  const userId = stored?.id ?? null;
  useEffect(() => {
    // Read the clock and sessionStorage after hydration; the static shell cannot know them.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setAccess(stored ? offlineAccess(stored, new Date(), isUnlockedInTab(stored.id)) : null);
  }, [stored]);
  const unlock = useCallback(
    async (pin: string): Promise<PinCheck> => {
      if (!userId) return { ok: false, message: "Nobody to unlock.", locked: true };
      const result = await checkDevicePin(userId, pin);
      if (result.ok) {
        markUnlockedInTab(userId, true);
        setAccess("open");
      } else if (result.locked) setAccess("signin");
      return result;
    },
    [userId],
  );
  return { access, unlock };
}
