import { apiRoute } from "@/lib/api/handler";
import { readAccountSettings } from "@/lib/users/admin-accounts";

export const dynamic = "force-dynamic";

// What a device needs to decide, offline, whether it may still open this person's data.
export const GET = apiRoute({}, async () => ({ offlineWindowHours: (await readAccountSettings()).offlineWindowHours }));
