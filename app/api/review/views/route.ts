import { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { reviewViewSchema } from "@/lib/review/view-schema";
import { deleteReviewView, getReviewViews, saveReviewView } from "@/lib/review/views";

export const GET = apiRoute({}, ({ user }) => getReviewViews(user));

// Body: a whole view ({ list, columns, sort, dir, pageSize, filters }); it replaces the saved one.
export const PUT = apiRoute({ body: reviewViewSchema }, ({ user, body }) => saveReviewView(user, body));

const deleteBody = z.object({ list: z.enum(["placements", "diaries"], { error: "List must be placements or diaries" }) }, { error: "Send { list }" });
export const DELETE = apiRoute({ body: deleteBody }, ({ user, body }) => deleteReviewView(user, body.list));
