import { apiRoute } from "@/lib/api/handler";
import { queryObject } from "@/lib/api/request";
import { reviewPlacements } from "@/lib/review/list";

// ?projects=&from=&to=&state=&hasWarnings=&sort=&dir=&page=&pageSize=&format=json|csv&columns=
export const GET = apiRoute({}, ({ req, user }) => reviewPlacements(user, queryObject(req)));
