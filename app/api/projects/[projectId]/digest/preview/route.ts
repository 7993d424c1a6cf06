import { parseOrThrow } from "@/lib/validation";
import { projectRoute } from "@/lib/api/project-route";
import { digestDateSchema, previewDigest } from "@/lib/digest/access";

type Params = { projectId: string };

/** The digest of ?date= as HTML (?format=json adds the subject and the text part). */
export const GET = projectRoute<Params>({ action: "digest.manage" }, async ({ req, access }) => {
  const date = parseOrThrow(digestDateSchema, req.nextUrl.searchParams.get("date") ?? "");
  const message = await previewDigest(access, date);
  if (req.nextUrl.searchParams.get("format") === "json") {
    return { subject: message.subject, html: message.html, text: message.text, isEmpty: message.isEmpty };
  }
  return new Response(message.html, {
    headers: {
      "content-type": "text/html; charset=utf-8",
      "cache-control": "private, no-store",
      // Shown in a sandboxed frame: no scripts, and links open outside the app.
      "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'; img-src 'self' data:; sandbox allow-popups allow-popups-to-escape-sandbox",
      "x-digest-subject": encodeURIComponent(message.subject),
    },
  });
});
