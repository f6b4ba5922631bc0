import { z } from 'zod';

const bool = z.enum(['true', 'false', '1', '0', 'yes', 'no']).transform((v) => v === 'true' || v === '1' || v === 'yes');

const port = z.coerce.number().int().min(0).max(65_535);

const DEV_SESSION_SECRET = 'dev-only-session-secret-change-me-0123456789';

const schema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: port.default(3000),
    PUBLIC_URL: z.url().default('http://127.0.0.1:3000'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// connection URL'),
    DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
    /** Requests waiting for a pooled connection beyond which new requests are shed with 503 (server/http/load-shed.ts). */
    DATABASE_QUEUE_MAX: z.coerce.number().int().min(0).max(100_000).default(400),
    /** Bench mode: count SQL queries and serve the count at GET /__bench/queries (never in normal use). */
    BENCH_QUERY_COUNT: bool.default(false),
    SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').default(DEV_SESSION_SECRET),
    SESSION_MAX_AGE_DAYS: z.coerce.number().int().min(1).max(365).default(30),
    /** Express's trust-proxy setting: `loopback`, a hop count, or a list of addresses. */
    TRUST_PROXY: z.string().min(1).default('loopback'),
    /** Multiplies every rate limit's allowance (tests that sign many people in from one address). */
    RATE_LIMIT_MULTIPLIER: z.coerce.number().int().min(1).max(100_000).default(1),
    S3_ENDPOINT: z.url().optional(),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_BUCKET: z
      .string()
      .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'must be a valid S3 bucket name')
      .default('rivet-reel-media'),
    S3_ACCESS_KEY_ID: z.string().min(1).default('S3RVER'),
    S3_SECRET_ACCESS_KEY: z.string().min(1).default('S3RVER'),
    S3_FORCE_PATH_STYLE: bool.optional(),
    SMTP_HOST: z.string().min(1).default('127.0.0.1'),
    SMTP_PORT: port.default(2525),
    SMTP_SECURE: bool.default(false),
    SMTP_USER: z.string().optional(),
    SMTP_PASS: z.string().optional(),
    MAIL_FROM: z.string().min(3).default('Rivet & Reel <no-reply@rivet-reel.test>'),
    MAIL_INBOX_URL: z.url().optional(),
    GITHUB_CLIENT_ID: z.string().min(1).default('rivet-reel-local'),
    GITHUB_CLIENT_SECRET: z.string().min(1).default('rivet-reel-local-secret'),
    GITHUB_AUTHORIZATION_URL: z.url().optional(),
    GITHUB_TOKEN_URL: z.url().optional(),
    GITHUB_USER_PROFILE_URL: z.url().optional(),
    GITHUB_USER_EMAIL_URL: z.url().optional(),
    DIST_DIR: z.string().min(1).default('dist'),
  })
  .superRefine((c, ctx) => {
    if (c.NODE_ENV === 'production' && c.SESSION_SECRET === DEV_SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'must be set in production' });
    }
  });

export type Config = z.infer<typeof schema> & { s3ForcePathStyle: boolean };

/** A configuration problem, naming every bad variable; the process should exit on it. */
export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid configuration:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

/** Reads and validates configuration from environment variables; throws ConfigError. */
export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const result = schema.safeParse(cleaned);
  if (!result.success) {
    throw new ConfigError(result.error.issues.map((i) => `${i.path.join('.') || '(root)'}: ${i.message}`));
  }
  const c = result.data;
  // A custom endpoint (s3rver, MinIO) needs path-style addressing; real S3 does not.
  return { ...c, s3ForcePathStyle: c.S3_FORCE_PATH_STYLE ?? c.S3_ENDPOINT !== undefined };
}
