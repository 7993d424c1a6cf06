import { apiRoute } from "@/lib/api/handler";
import { changePassword } from "@/lib/users/account";
import { changePasswordSchema } from "@/lib/users/schemas";

export const POST = apiRoute({ body: changePasswordSchema }, ({ user, body }) => changePassword(user, body));
