import { apiRoute } from "@/lib/api/handler";
import { signOutEverywhere } from "@/lib/users/account";

export const POST = apiRoute({}, ({ user }) => signOutEverywhere(user));
