import { apiRoute } from "@/lib/api/handler";
import { listLabQueue } from "@/lib/lab/queue";
import { queryObject } from "@/lib/api/request";

export const GET = apiRoute({}, ({ req, user }) => listLabQueue(user, queryObject(req)));
