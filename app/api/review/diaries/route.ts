import { apiRoute } from "@/lib/api/handler";
import { queryObject } from "@/lib/api/request";
import { reviewDiaries } from "@/lib/review/list";

// ?projects=&from=&to=&state=missing,draft,submitted&sort=&dir=&page=&pageSize=&format=json|csv&columns=
export const GET = apiRoute({}, ({ req, user }) => reviewDiaries(user, queryObject(req)));
