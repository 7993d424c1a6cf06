// Browser-side helper for our JSON API: returns data or a typed error with field messages.
export type ApiError = { code: string; message: string; fields?: Record<string, string> };

export async function callApi<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<{ ok: true; data: T } | { ok: false; error: ApiError }> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: init.method ?? (init.body === undefined ? "GET" : "POST"),
      headers: init.body === undefined ? undefined : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
  } catch {
    return { ok: false, error: { code: "offline", message: "No connection. This needs a network; try again when you have signal." } };
  }
  const json = await res.json().catch(() => null);
  if (!res.ok) return { ok: false, error: json?.error ?? { code: "http", message: `The server answered ${res.status}.` } };
  return { ok: true, data: json as T };
}
