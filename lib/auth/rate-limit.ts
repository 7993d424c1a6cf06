import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { getPool } from "@/db";
import { AppError } from "@/lib/errors";

// Wrong passwords per e-mail address: 5 in 15 minutes, then locked for 15 minutes.
// Stored in Postgres (table rate_limits, created by our migrations) so every app instance agrees.
const POINTS = 5;
const DURATION_S = 15 * 60;

let limiter: RateLimiterPostgres | undefined;
function getLimiter(): RateLimiterPostgres {
  limiter ??= new RateLimiterPostgres({
    storeClient: getPool(),
    storeType: "pool",
    tableName: "rate_limits",
    tableCreated: true,
    keyPrefix: "signin",
    points: POINTS,
    duration: DURATION_S,
    blockDuration: DURATION_S,
    clearExpiredByTimeout: false,
  });
  return limiter;
}

const key = (email: string) => email.trim().toLowerCase();

function lockedMessage(res: RateLimiterRes): string {
  const minutes = Math.max(1, Math.ceil(res.msBeforeNext / 60_000));
  return `Too many wrong passwords for this address. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}, or use a sign-in link.`;
}

/** Throws rate_limited when the address is locked. */
export async function assertNotLocked(email: string): Promise<void> {
  const res = await getLimiter().get(key(email));
  if (res && res.consumedPoints >= POINTS) throw new AppError("rate_limited", lockedMessage(res));
}

/** Records one wrong password; throws rate_limited when this one crossed the limit. */
export async function recordFailure(email: string): Promise<void> {
  try {
    await getLimiter().consume(key(email));
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) throw new AppError("rate_limited", lockedMessage(rejection));
    throw rejection;
  }
}

export async function clearFailures(email: string): Promise<void> {
  await getLimiter().delete(key(email));
}
