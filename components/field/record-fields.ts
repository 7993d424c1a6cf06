// Ordering records stored on this device by their fields.

/** Orders records by one of their instants (ISO strings sort in time order; a missing one first). */
export const byTime =
  <K extends string>(field: K) =>
  (a: { [F in K]?: string | null }, b: { [F in K]?: string | null }) =>
    (a[field] ?? "").localeCompare(b[field] ?? "");
