// The sync endpoints over HTTP: posting a request as JSON, and the words for what the network said.
export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** POSTs a sync request as JSON; null when the network could not be reached at all. */
export async function postSyncJson(fetchFn: FetchLike, url: string, body: unknown): Promise<Response | null> {
  try {
    return await fetchFn(url, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
      credentials: "same-origin",
      cache: "no-store",
    });
  } catch {
    return null;
  }
}

export const MESSAGES = {
  offline: "No connection to the server. Your changes stay on this device and are sent when the connection is back.",
  busy: "The server is busy or being updated. Your changes stay on this device; trying again shortly.",
  signIn: "Sign in again to sync. Your changes stay on this device.",
  gap: "Some changes were out of order; they are being sent again in order.",
  noAnswer: "The server did not answer this change; it will be sent again.",
} as const;
