// The one home of the server's configuration: every environment variable the app, the worker and
// the scripts read is named, typed and checked here, once. A bad setting stops the process at boot
// with one line naming every missing or malformed variable (never its value: some are secrets).
import { z } from "zod";

const int = (min: number, max: number, fallback: number) =>
  z
    .string()
    .trim()
    .regex(/^\d+$/, "must be a whole number")
    .transform(Number)
    .pipe(z.number().min(min, `must be at least ${min}`).max(max, `must be at most ${max}`))
    .optional()
    .transform((v) => v ?? fallback);

const url = (protocols: string[]) =>
  z
    .string()
    .trim()
    .refine((v) => {
      try {
        return protocols.includes(new URL(v).protocol);
      } catch {
        return false;
      }
    }, `must be a URL starting with ${protocols.map((p) => `${p}//`).join(" or ")}`);

const flag = (fallback: boolean) =>
  z
    .enum(["true", "false"], { message: "must be true or false" })
    .optional()
    .transform((v) => (v === undefined ? fallback : v === "true"));

const text = (fallback: string) => z.string().trim().min(1, "must not be empty").optional().transform((v) => v ?? fallback);

export const envSchema = z.object({
  DATABASE_URL: url(["postgres:", "postgresql:"]),
  /** Connections per app instance (PostgreSQL's max_connections is shared by every instance and the worker). */
  DATABASE_POOL_MAX: int(1, 200, 10),
  /** Connections per app instance kept for short reads (session check, sync pull: db/index.ts readDb), beside DATABASE_POOL_MAX. */
  DATABASE_READ_POOL_MAX: int(1, 200, 4),
  /** A statement running longer is cancelled by PostgreSQL; 0 turns the limit off. */
  DATABASE_STATEMENT_TIMEOUT_MS: int(0, 3_600_000, 30_000),
  NEXTAUTH_SECRET: z.string().min(16, "must be at least 16 characters (use a long random value)"),
  NEXTAUTH_URL: url(["http:", "https:"]).optional(),
  APP_ORIGIN: url(["http:", "https:"]).optional(),
  SMTP_URL: url(["smtp:", "smtps:"]).optional().transform((v) => v ?? "smtp://127.0.0.1:2525"),
  MAIL_FROM: text("Placewright <no-reply@placewright.example.test>"),
  /** Absent: AWS S3 itself (region and credentials below). */
  S3_ENDPOINT: url(["http:", "https:"]).optional(),
  S3_REGION: text("us-east-1"),
  S3_BUCKET: text("placewright-photos"),
  S3_ACCESS_KEY_ID: text("S3RVER"),
  S3_SECRET_ACCESS_KEY: text("S3RVER"),
  S3_FORCE_PATH_STYLE: flag(false),
  /** "off": this instance runs no digest worker (run `npm run worker` elsewhere, or let another instance run it). */
  DIGEST_WORKER: z.enum(["on", "off"], { message: "must be on or off" }).optional().transform((v) => v ?? "on"),
  DIGEST_POLL_SECONDS: int(1, 600, 10),
  LOG_LEVEL: z
    .enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"], { message: "must be one of fatal, error, warn, info, debug, trace, silent" })
    .optional()
    .transform((v) => v ?? "info"),
  /** How long SIGTERM waits for requests in flight before closing anyway. */
  SHUTDOWN_TIMEOUT_MS: int(0, 600_000, 25_000),
});

export type Config = ReturnType<typeof shape>;

function shape(env: z.output<typeof envSchema>) {
  return {
    database: { url: env.DATABASE_URL, poolMax: env.DATABASE_POOL_MAX, readPoolMax: env.DATABASE_READ_POOL_MAX, statementTimeoutMs: env.DATABASE_STATEMENT_TIMEOUT_MS },
    auth: { secret: env.NEXTAUTH_SECRET },
    origin: (env.APP_ORIGIN ?? env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, ""),
    mail: { smtpUrl: env.SMTP_URL, from: env.MAIL_FROM },
    s3: {
      endpoint: env.S3_ENDPOINT,
      region: env.S3_REGION,
      bucket: env.S3_BUCKET,
      accessKeyId: env.S3_ACCESS_KEY_ID,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY,
      forcePathStyle: env.S3_FORCE_PATH_STYLE,
    },
    digest: { worker: env.DIGEST_WORKER === "on", pollSeconds: env.DIGEST_POLL_SECONDS },
    logLevel: env.LOG_LEVEL,
    shutdownTimeoutMs: env.SHUTDOWN_TIMEOUT_MS,
  };
}

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Configuration error: ${problems.join("; ")}. Set them in the environment and start again.`);
    this.name = "ConfigError";
  }
}

/** Parses an environment; throws ConfigError naming each missing or malformed variable (values are never echoed). */
export function parseConfig(env: Record<string, string | undefined>): Config {
  // An empty variable counts as unset, as most deployment tools write it that way.
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ""));
  const result = envSchema.safeParse(cleaned);
  if (result.success) return shape(result.data);
  const problems = result.error.issues.map((issue) => {
    const name = String(issue.path[0]);
    return cleaned[name] === undefined ? `${name} is missing` : `${name} ${issue.message}`;
  });
  throw new ConfigError([...new Set(problems)]);
}

const globalForConfig = globalThis as typeof globalThis & { placewrightConfig?: Config };

/** The validated configuration of this process, read once. */
export function config(): Config {
  return (globalForConfig.placewrightConfig ??= parseConfig(process.env));
}

/** Forgets the parsed configuration (tests that change the environment). */
export function resetConfig(): void {
  globalForConfig.placewrightConfig = undefined;
}

/** For process entry points: validate now, or print the one line and exit with status 78 (EX_CONFIG). */
export function configOrExit(): Config {
  try {
    return config();
  } catch (error) {
    if (!(error instanceof ConfigError)) throw error;
    process.stderr.write(`${error.message}\n`);
    process.exit(78);
  }
}
