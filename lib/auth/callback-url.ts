// Where to go after signing in. Pure (no Node, no React) so the sign-in forms and the e-mailed link
// use the same check. A prefix test ("starts with / but not //") lets "/\evil.example" and
// "/<tab>/evil.example" through, because browsers treat "\" as "/" and drop tabs and newlines;
// resolving against our own origin, as the browser will, and requiring that origin does not.
// [WHATWG URL Standard, "special" schemes: backslash as path separator, ASCII tab/newline removed]

const BASE = "https://placewright.invalid";

/** The same-origin path (with query and fragment) of `raw`, or `fallback` when it leaves the app. */
export function safeCallbackPath(raw: string | null | undefined, fallback = "/today"): string {
  if (!raw) return fallback;
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}
