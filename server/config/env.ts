// The environment is parsed once, here, and nothing else reads process.env.
import { z } from 'zod';
import { isValidTimeZone } from '../../shared/format/dates';

const booleanFromEnv = z
  .enum(['true', 'false', '1', '0'])
  .transform((value) => value === 'true' || value === '1');

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180), // 0: any free port (tests)
  /** Public address used in e-mail links; defaults to http://HOST:PORT. */
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_URL: z.string().regex(/^mariadb:\/\//, 'DATABASE_URL must start with mariadb://'),
  /** The owner account that runs migrations (DDL); the app itself connects with DATABASE_URL. */
  DATABASE_OWNER_URL: z.string().regex(/^mariadb:\/\//, 'DATABASE_OWNER_URL must start with mariadb://').optional(),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  /** Bounded waits on the database: a hung server turns into 503s, not requests that hang. */
  DATABASE_ACQUIRE_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(2_000),
  DATABASE_QUERY_TIMEOUT_MS: z.coerce.number().int().min(500).max(600_000).default(10_000),
  /** Key of the trail's HMAC chain (kept outside the database); without it, TRAIL_KEY_FILE is read or created. */
  TRAIL_HMAC_KEY: z.string().min(32, 'TRAIL_HMAC_KEY must be at least 32 characters').optional(),
  TRAIL_KEY_FILE: z.string().default('.data/trail-key'),
  /** Append-only log of the trail's anchors (head sequence and hash), outside the database. */
  TRAIL_ANCHOR_FILE: z.string().default('.data/trail-anchors.log'),
  /** Requests one process works on at once; past it, 503 with Retry-After (load shedding). */
  MAX_IN_FLIGHT_REQUESTS: z.coerce.number().int().min(1).max(10_000).default(100),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).default(12),
  /** Set when served over TLS (directly or behind a proxy that terminates it): cookies become Secure. */
  COOKIE_SECURE: booleanFromEnv.default(false),
  TRUST_PROXY: booleanFromEnv.default(false),
  SIGNIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  SIGNIN_RATE_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  /** Failed passwords in a row that lock an account for a while (1, 2, 4 … minutes, up to ACCOUNT_LOCK_MAX_MINUTES). */
  ACCOUNT_LOCK_THRESHOLD: z.coerce.number().int().min(1).default(10),
  ACCOUNT_LOCK_MAX_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(60),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Whorl <whorl@localhost>'),
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1).default(25 * 1024 * 1024),
  UPLOAD_MAX_FILES: z.coerce.number().int().min(1).default(10),
  STORAGE_DRIVER: z.enum(['local', 's3']).default('local'),
  STORAGE_DIR: z.string().default('.data/evidence'),
  S3_ENDPOINT: z.string().optional(),
  S3_BUCKET: z.string().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  SCHEDULER: booleanFromEnv.default(true),
  SCHEDULER_INTERVAL_SECONDS: z.coerce.number().int().min(1).default(60),
  /** Reminder timing: due-soon notice, escalation to the quality manager, audit notice, digest hour (UTC). */
  REMINDER_DUE_SOON_DAYS: z.coerce.number().int().min(1).max(90).default(7),
  REMINDER_ESCALATE_AFTER_DAYS: z.coerce.number().int().min(1).max(90).default(3),
  REMINDER_AUDIT_NOTICE_DAYS: z.coerce.number().int().min(1).max(90).default(7),
  MAIL_DIGEST_HOUR_UTC: z.coerce.number().int().min(0).max(23).default(6),
  LOG_LEVEL: z.enum(['silent', 'error', 'info', 'debug']).default('info'),
  /** The organisation's name on reports when none is stored (the demo seed stores Tarnbrook's). */
  ORG_NAME: z.string().trim().min(1).max(200).default('Whorl'),
  /** IANA time zone in which dates and times are shown (signatures are stated in UTC as well). */
  ORG_TIME_ZONE: z
    .string()
    .default('UTC')
    .refine(isValidTimeZone, 'ORG_TIME_ZONE must be an IANA time zone such as Europe/London or UTC'),
});

export type Env = z.infer<typeof EnvSchema>;

export interface AppConfig {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  publicUrl: string;
  databaseUrl: string;
  databaseOwnerUrl?: string;
  databasePoolMax: number;
  database: { acquireTimeoutMs: number; queryTimeoutMs: number };
  trail: { hmacKey?: string; keyFile: string; anchorFile: string };
  maxInFlightRequests: number;
  session: { secret: string; idleMinutes: number; absoluteHours: number; cookieSecure: boolean };
  trustProxy: boolean;
  signIn: { rateLimit: number; rateWindowMinutes: number; lockThreshold: number; maxLockMinutes: number };
  mail: { smtpUrl?: string; from: string };
  uploads: { maxBytes: number; maxFiles: number };
  storage: {
    driver: 'local' | 's3';
    dir: string;
    s3: { endpoint?: string; bucket?: string; region: string; accessKeyId?: string; secretAccessKey?: string };
  };
  scheduler: { enabled: boolean; intervalSeconds: number };
  reminders: { dueSoonDays: number; escalateAfterDays: number; auditNoticeDays: number; digestHourUtc: number };
  logLevel: Env['LOG_LEVEL'];
  organisation: { name: string; timeZone: string };
}

export function loadConfig(source: Record<string, string | undefined> = process.env): AppConfig {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  return {
    env: env.NODE_ENV,
    host: env.HOST,
    port: env.PORT,
    publicUrl: env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`,
    databaseUrl: env.DATABASE_URL,
    databaseOwnerUrl: env.DATABASE_OWNER_URL,
    databasePoolMax: env.DATABASE_POOL_MAX,
    database: { acquireTimeoutMs: env.DATABASE_ACQUIRE_TIMEOUT_MS, queryTimeoutMs: env.DATABASE_QUERY_TIMEOUT_MS },
    trail: { hmacKey: env.TRAIL_HMAC_KEY, keyFile: env.TRAIL_KEY_FILE, anchorFile: env.TRAIL_ANCHOR_FILE },
    maxInFlightRequests: env.MAX_IN_FLIGHT_REQUESTS,
    session: {
      secret: env.SESSION_SECRET,
      idleMinutes: env.SESSION_IDLE_MINUTES,
      absoluteHours: env.SESSION_ABSOLUTE_HOURS,
      cookieSecure: env.COOKIE_SECURE,
    },
    trustProxy: env.TRUST_PROXY,
    signIn: {
      rateLimit: env.SIGNIN_RATE_LIMIT,
      rateWindowMinutes: env.SIGNIN_RATE_WINDOW_MINUTES,
      lockThreshold: env.ACCOUNT_LOCK_THRESHOLD,
      maxLockMinutes: env.ACCOUNT_LOCK_MAX_MINUTES,
    },
    mail: { smtpUrl: env.SMTP_URL, from: env.MAIL_FROM },
    uploads: { maxBytes: env.UPLOAD_MAX_BYTES, maxFiles: env.UPLOAD_MAX_FILES },
    storage: {
      driver: env.STORAGE_DRIVER,
      dir: env.STORAGE_DIR,
      s3: {
        endpoint: env.S3_ENDPOINT,
        bucket: env.S3_BUCKET,
        region: env.S3_REGION,
        accessKeyId: env.S3_ACCESS_KEY_ID,
        secretAccessKey: env.S3_SECRET_ACCESS_KEY,
      },
    },
    scheduler: { enabled: env.SCHEDULER, intervalSeconds: env.SCHEDULER_INTERVAL_SECONDS },
    reminders: {
      dueSoonDays: env.REMINDER_DUE_SOON_DAYS,
      escalateAfterDays: env.REMINDER_ESCALATE_AFTER_DAYS,
      auditNoticeDays: env.REMINDER_AUDIT_NOTICE_DAYS,
      digestHourUtc: env.MAIL_DIGEST_HOUR_UTC,
    },
    logLevel: env.LOG_LEVEL,
    organisation: { name: env.ORG_NAME, timeZone: env.ORG_TIME_ZONE },
  };
}
