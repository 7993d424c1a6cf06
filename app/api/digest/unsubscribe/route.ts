import { publicRoute } from "@/lib/api/handler";
import { unsubscribeWithToken } from "@/lib/digest/recipients";

// No sign-in: the signed token is the authority. Mail programs post here for one-click unsubscribe
// (RFC 8058); the confirmation page posts here too. A GET never unsubscribes (link scanners fetch links).
export const POST = publicRoute({}, async ({ req }) => {
  const result = await unsubscribeWithToken(req.nextUrl.searchParams.get("token"));
  return { ok: true, projectName: result.projectName, email: result.email };
});
