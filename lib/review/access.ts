// Which projects a review list may read is lib/projects/readable.ts; this keeps the SQL helper.

/** A Postgres uuid[] literal of already validated ids (one bound parameter, whatever the count). */
export const uuidArray = (ids: string[]) => `{${ids.join(",")}}`;
