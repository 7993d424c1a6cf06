import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { getPool } from "@/db";
import { AppError } from "@/lib/errors";

// Every throttle of the app, stored in Postgres (table rate_limits, created by our migrations) so
// every app instance counts the same attempts. A point is consumed *before* the guarded work runs
// (parallel guesses cannot all pass a check made first), and given back when the attempt succeeds.
// [common practice: OWASP Authentication Cheat Sheet, "Protect against automated attacks"]

const MINUTES_15 = 15 * 60;
const HOUR = 60 * 60;

type Limit = { points: number; durationS: number; blockS: number; message: string };

export const LIMITS = {
  /** Wrong passwords per address. */
  signInEmail: { points: 5, durationS: MINUTES_15, blockS: MINUTES_15, message: "Too many wrong passwords for this address." },
  /** Sign-in attempts per client address, whatever the e-mail (spraying one password over many accounts). */
  signInIp: { points: 30, durationS: MINUTES_15, blockS: MINUTES_15, message: "Too many sign-in attempts from this network." },
  /** Sign-in link e-mails per address and per client address. */
  linkEmail: { points: 3, durationS: HOUR, blockS: HOUR, message: "Several sign-in links were sent to this address already." },
  linkIp: { points: 20, durationS: HOUR, blockS: HOUR, message: "Too many sign-in links were asked for from this network." },
  /** Invitation attempts per client address (a wrong or used token counts). */
  invitationIp: { points: 10, durationS: MINUTES_15, blockS: MINUTES_15, message: "Too many invitation attempts from this network." },
  /** The password re-entered to sign, per user. */
  signerPassword: { points: 5, durationS: MINUTES_15, blockS: MINUTES_15, message: "Too many wrong passwords while signing." },
} satisfies Record<string, Limit>;
export type LimitName = keyof typeof LIMITS;

const limiters = new Map<LimitName, RateLimiterPostgres>();
function limiter(name: LimitName): RateLimiterPostgres {
  let found = limiters.get(name);
  if (!found) {
    const limit: Limit = LIMITS[name];
    found = new RateLimiterPostgres({
      storeClient: getPool(),
      storeType: "pool",
      tableName: "rate_limits",
      tableCreated: true,
      // The first one keeps its historic prefix so existing lock-outs carry over.
      keyPrefix: name === "signInEmail" ? "signin" : name,
      points: limit.points,
      duration: limit.durationS,
      blockDuration: limit.blockS,
      clearExpiredByTimeout: false,
    });
    limiters.set(name, found);
  }
  return found;
}

const normalise = (key: string) => key.trim().toLowerCase();

function limited(name: LimitName, res: RateLimiterRes): AppError {
  const minutes = Math.max(1, Math.ceil(res.msBeforeNext / 60_000));
  return new AppError("rate_limited", `${LIMITS[name].message} Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`, undefined, {
    retryAfterS: Math.ceil(res.msBeforeNext / 1000),
  });
}

/** Takes one point from `key` under `name`; throws rate_limited when none is left. */
export async function consume(name: LimitName, key: string): Promise<void> {
  try {
    await limiter(name).consume(normalise(key));
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) throw limited(name, rejection);
    throw rejection;
  }
}

/** Gives the point back (the attempt succeeded). */
export async function refund(name: LimitName, key: string): Promise<void> {
  await limiter(name).reward(normalise(key), 1);
}

/** Forgets every attempt of `key` (a correct password clears the address's wrong ones). */
export async function clear(name: LimitName, key: string): Promise<void> {
  await limiter(name).delete(normalise(key));
}

/**
 * The client's address as the nearest proxy saw it: the last X-Forwarded-For entry (earlier ones are
 * whatever the client wrote). Without a proxy there is no header and all callers share one bucket
 * per app, which errs on the side of refusing; run behind one proxy that sets the header (README).
 */
export function clientAddress(headers: Headers | Record<string, string | string[] | undefined> | undefined): string {
  const get = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const value = headers[name];
    return Array.isArray(value) ? value.join(",") : value;
  };
  const forwarded = get("x-forwarded-for");
  const last = forwarded?.split(",").map((s) => s.trim()).filter(Boolean).pop();
  return last ?? get("x-real-ip") ?? "unknown";
}
