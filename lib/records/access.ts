import type { Action } from "@/lib/auth/can";

/** A record type's write action, or the office's correction of any unsigned record. */
export const writeActions = (action: Action): Action[] => [action, "record.correct"];
