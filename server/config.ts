import { z } from 'zod';
import { defaultPoolSize, type EnginePoolOptions } from './pool';
import type { EvaluationLimits } from './services/evaluation-limits';
import { DEFAULT_THROTTLE, type ThrottleRules } from './services/sign-in-throttle';

const DEV_SESSION_SECRET = 'phasewright-development-secret-change-me';

const booleanFromEnv = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', ''])
  .transform((value) => value === '1' || value === 'true' || value === 'yes');

/** TRUST_PROXY: "false" (default), "true", a hop count, or an Express trust-proxy list such as "loopback". */
const trustProxyFromEnv = z.string().transform((value): boolean | number | string => {
  if (value === '' || value === 'false' || value === '0') return false;
  if (value === 'true') return true;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
});

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    APP_URL: z.url().optional(),
    DATABASE_URL: z
      .string()
      .min(1)
      .default('postgres://phasewright_app@127.0.0.1:54329/phasewright'),
    DATABASE_OWNER_URL: z.string().optional(),
    SESSION_SECRET: z
      .string()
      .min(16, { message: 'SESSION_SECRET must be at least 16 characters.' })
      .optional(),
    SESSION_IDLE_MINUTES: z.coerce
      .number()
      .int()
      .min(1)
      .max(60 * 24 * 30)
      .default(120),
    TRUST_PROXY: trustProxyFromEnv.default(false),
    SMTP_URL: z.string().optional(),
    SMTP_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(0),
    MAIL_FROM: z.string().default('Phasewright <no-reply@phasewright.invalid>'),
    PHASEWRIGHT_SEED_DEMO: booleanFromEnv.default(false),
    STATIC_DIR: z.string().default('dist'),
    SIGN_IN_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
    RESET_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
    JOB_POLL_SECONDS: z.coerce.number().min(0.5).default(2),
    JOB_STALE_MINUTES: z.coerce.number().min(1).default(10),
    ENGINE_WORKERS: z.coerce.number().int().min(1).max(64).optional(),
    ENGINE_QUEUE_LIMIT: z.coerce.number().int().min(1).default(64),
    ENGINE_TASK_SECONDS: z.coerce.number().min(1).default(30),
    ENGINE_WORKER_MEMORY_MB: z.coerce.number().int().min(64).default(1024),
    ENGINE_IDLE_SECONDS: z.coerce.number().min(0).default(60),
    EVALUATE_MAX_STEPS: z.coerce.number().int().min(1).default(300),
    EVALUATE_MAX_REPLY_MB: z.coerce.number().min(0.1).default(8),
    MONTE_CARLO_MAX_STEP_DRAWS: z.coerce.number().int().min(1).default(200_000),
    CALCULATIONS_PER_USER: z.coerce.number().int().min(1).default(2),
    MONTE_CARLO_JOBS_PER_USER: z.coerce.number().int().min(1).default(2),
    SIGN_IN_FREE_FAILURES_PAIR: z.coerce.number().int().min(1).default(5),
    SIGN_IN_FREE_FAILURES_ACCOUNT: z.coerce.number().int().min(1).default(20),
    SIGN_IN_FREE_FAILURES_ADDRESS: z.coerce.number().int().min(1).default(50),
    SESSION_MAX_HOURS: z.coerce
      .number()
      .min(0.01)
      .max(24 * 30)
      .default(12),
    DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(500).default(10),
    SESSION_POOL_MAX: z.coerce.number().int().min(1).max(500).default(10),
    SHUTDOWN_GRACE_SECONDS: z.coerce.number().min(0).default(20),
    STORAGE_DRIVER: z.enum(['local', 's3', '']).default(''),
    FILES_DIR: z.string().default('.data/files'),
    S3_BUCKET: z.string().optional(),
    S3_ENDPOINT: z.url().optional(),
    S3_REGION: z.string().default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    S3_FORCE_PATH_STYLE: booleanFromEnv.default(true),
    S3_PREFIX: z.string().default(''),
    CHROMATOGRAM_MAX_MB: z.coerce.number().min(0.001).max(2000).default(20),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({
        code: 'custom',
        path: ['SESSION_SECRET'],
        message: 'SESSION_SECRET is required in production.',
      });
    }
    if (env.NODE_ENV === 'production' && env.PHASEWRIGHT_SEED_DEMO) {
      ctx.addIssue({
        code: 'custom',
        path: ['PHASEWRIGHT_SEED_DEMO'],
        message: 'The demo data is never seeded in production.',
      });
    }
    // A run writes its progress after every engine chunk, and a chunk stops at
    // ENGINE_TASK_SECONDS; a run silent for less than twice that may still be alive.
    if (env.JOB_STALE_MINUTES * 60 < 2 * env.ENGINE_TASK_SECONDS) {
      ctx.addIssue({
        code: 'custom',
        path: ['JOB_STALE_MINUTES'],
        message: 'JOB_STALE_MINUTES must be at least twice ENGINE_TASK_SECONDS (in minutes).',
      });
    }
    if (env.STORAGE_DRIVER === 's3' && !env.S3_BUCKET) {
      ctx.addIssue({
        code: 'custom',
        path: ['S3_BUCKET'],
        message: 'S3_BUCKET is required when STORAGE_DRIVER=s3.',
      });
    }
  });

export interface S3Config {
  bucket: string;
  /** Null: the AWS endpoint of the region. */
  endpoint: string | null;
  region: string;
  /** Null: the SDK's default credential chain (environment, profile, instance role). */
  accessKeyId: string | null;
  secretAccessKey: string | null;
  forcePathStyle: boolean;
  /** Prepended to every object key ("phasewright/"). */
  prefix: string;
}

/** Where uploaded files are kept (server/storage). */
export interface StorageConfig {
  driver: 'local' | 's3';
  /** The folder of the local driver. */
  dir: string;
  s3: S3Config;
}

export interface AppConfig {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  /** Public address of the app; links in e-mails point here. */
  appUrl: string;
  /** The server's own role: reads and writes data, owns nothing. */
  databaseUrl: string;
  /** The role that owns the schema and runs migrations; the server role when unset. */
  databaseOwnerUrl: string;
  sessionSecret: string;
  sessionIdleMinutes: number;
  trustProxy: boolean | number | string;
  /** Null means: start the built-in mail fake and send to it. */
  smtpUrl: string | null;
  smtpFakePort: number;
  mailFrom: string;
  seedDemo: boolean;
  staticDir: string;
  /** The outbox page exists only outside production. */
  outboxEnabled: boolean;
  rateLimits: { signInPerWindow: number; resetPerWindow: number; windowMinutes: number };
  jobPollSeconds: number;
  /** A running job whose progress was not written for this long is taken as abandoned. */
  jobStaleSeconds: number;
  /** The engine pool's workers, queue and limits (docs/deployment.md). */
  pool: EnginePoolOptions;
  evaluation: EvaluationLimits;
  /** Growing waits after failed sign-ins, by account and address. */
  signInThrottle: ThrottleRules;
  /** Absolute lifetime of a session, however active. */
  sessionMaxHours: number;
  /** How long shutdown waits for requests in flight. */
  shutdownGraceSeconds: number;
  storage: StorageConfig;
  /** Largest chromatogram or document accepted [bytes]. */
  chromatogramMaxBytes: number;
  /**
   * Connections each server process opens: `max` for the data (Sequelize), `sessionMax`
   * for sessions and rate limits (and one more listening for session and role changes). N
   * processes need N × (max + sessionMax + 1) below the database's max_connections
   * (docs/deployment.md).
   */
  databasePool: { max: number; sessionMax: number };
}

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid configuration:\n  ${problems.join('\n  ')}`);
    this.name = 'ConfigError';
  }
}

/** Reads the configuration from environment variables, with safe defaults for development. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    throw new ConfigError(
      parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`),
    );
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    appUrl: (e.APP_URL ?? `http://127.0.0.1:${e.PORT}`).replace(/\/+$/, ''),
    databaseUrl: e.DATABASE_URL,
    databaseOwnerUrl: e.DATABASE_OWNER_URL ? e.DATABASE_OWNER_URL : e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET ?? DEV_SESSION_SECRET,
    sessionIdleMinutes: e.SESSION_IDLE_MINUTES,
    trustProxy: e.TRUST_PROXY,
    smtpUrl: e.SMTP_URL ? e.SMTP_URL : null,
    smtpFakePort: e.SMTP_FAKE_PORT,
    mailFrom: e.MAIL_FROM,
    seedDemo: e.PHASEWRIGHT_SEED_DEMO,
    staticDir: e.STATIC_DIR,
    outboxEnabled: e.NODE_ENV !== 'production',
    rateLimits: {
      signInPerWindow: e.SIGN_IN_RATE_LIMIT,
      resetPerWindow: e.RESET_RATE_LIMIT,
      windowMinutes: 15,
    },
    jobPollSeconds: e.JOB_POLL_SECONDS,
    jobStaleSeconds: e.JOB_STALE_MINUTES * 60,
    pool: {
      size: e.ENGINE_WORKERS ?? defaultPoolSize(),
      maxQueue: e.ENGINE_QUEUE_LIMIT,
      taskTimeoutMs: e.ENGINE_TASK_SECONDS * 1000,
      workerMemoryMb: e.ENGINE_WORKER_MEMORY_MB,
      idleMs: e.ENGINE_IDLE_SECONDS * 1000,
    },
    evaluation: {
      maxSteps: e.EVALUATE_MAX_STEPS,
      maxStepDraws: e.MONTE_CARLO_MAX_STEP_DRAWS,
      maxReplyBytes: Math.round(e.EVALUATE_MAX_REPLY_MB * 1e6),
      perUserConcurrent: e.CALCULATIONS_PER_USER,
      perUserJobs: e.MONTE_CARLO_JOBS_PER_USER,
    },
    signInThrottle: {
      ...DEFAULT_THROTTLE,
      pair: { ...DEFAULT_THROTTLE.pair, free: e.SIGN_IN_FREE_FAILURES_PAIR },
      account: { ...DEFAULT_THROTTLE.account, free: e.SIGN_IN_FREE_FAILURES_ACCOUNT },
      address: { ...DEFAULT_THROTTLE.address, free: e.SIGN_IN_FREE_FAILURES_ADDRESS },
    },
    sessionMaxHours: e.SESSION_MAX_HOURS,
    shutdownGraceSeconds: e.SHUTDOWN_GRACE_SECONDS,
    storage: {
      // S3 when asked, or when a bucket is named and nothing else was asked.
      driver:
        e.STORAGE_DRIVER === 's3' || (e.STORAGE_DRIVER === '' && e.S3_BUCKET) ? 's3' : 'local',
      dir: e.FILES_DIR,
      s3: {
        bucket: e.S3_BUCKET ?? '',
        endpoint: e.S3_ENDPOINT ?? null,
        region: e.S3_REGION,
        accessKeyId: e.S3_ACCESS_KEY_ID || null,
        secretAccessKey: e.S3_SECRET_ACCESS_KEY || null,
        forcePathStyle: e.S3_FORCE_PATH_STYLE,
        prefix: e.S3_PREFIX,
      },
    },
    chromatogramMaxBytes: Math.round(e.CHROMATOGRAM_MAX_MB * 1024 * 1024),
    databasePool: { max: e.DATABASE_POOL_MAX, sessionMax: e.SESSION_POOL_MAX },
  };
}
