import { apiRoute } from "@/lib/api/handler";
import { setUserDisabled } from "@/lib/users/admin-accounts";
import { userStatusSchema } from "@/lib/users/schemas";

export const POST = apiRoute<{ userId: string }, { disabled: boolean }>({ body: userStatusSchema }, ({ user, params, body }) =>
  setUserDisabled(user, params.userId, body.disabled),
);
