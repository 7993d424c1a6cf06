import { rememberOfflineWindow } from "./device-access";

/** Fetches the administrator's offline window while the session is good and keeps it on the device. */
export async function rememberDevicePolicy(userId: string): Promise<void> {
  const res = await fetch("/api/account/device-policy", { cache: "no-store", credentials: "same-origin" }).catch(() => null);
  if (!res?.ok) return;
  const body = (await res.json().catch(() => null)) as { offlineWindowHours?: unknown } | null;
  if (typeof body?.offlineWindowHours === "number") await rememberOfflineWindow(userId, body.offlineWindowHours);
}
