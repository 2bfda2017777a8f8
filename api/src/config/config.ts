import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** Every setting the api reads, documented in .env.example. Parsed once at start-up. */
const ConfigSchema = z.object({
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4600),
  PUBLIC_URL: z.url().optional(),
  DATABASE_URL: z.string().startsWith('postgres'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  COOKIE_SECURE: flag.default(false),
  OIDC_ISSUER: z.url(),
  OIDC_CLIENT_ID: z.string().min(1),
  OIDC_CLIENT_SECRET: z.string().min(1),
  OIDC_ROLE_GROUP_PREFIX: z.string().default('shadowloop:'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(4625),
  MAIL_FROM: z.string().default('Shadowloop <shadowloop@quillmere.example>'),
  DEV_MAILBOX: flag.default(false),
  WEB_DIST: z.string().default(path.join(repoRoot, 'web/dist')),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SIGN_IN_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(30),
  SIMULATOR_HEARTBEAT_MAX_AGE_S: z.coerce.number().positive().default(30),
  INGEST_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(60_000),
  INGEST_MAX_BODY_MB: z.coerce.number().positive().max(256).default(16),
  INGEST_FUTURE_TOLERANCE_S: z.coerce.number().min(0).default(60),
  INGEST_MAX_AGE_DAYS: z.coerce.number().positive().default(30),
  /** Every readings batch waits for its commit to reach the disk, not only those that change alerts. */
  INGEST_SYNCHRONOUS_COMMIT: flag.default(false),
  IMPORT_MAX_FILE_MB: z.coerce.number().positive().max(4096).default(200),
  /** The api's background work: mail outbox sender, shelve expiry, escalation, stale rules. */
  ALERT_WORKERS: flag.default(true),
  ALERT_SWEEP_INTERVAL_MS: z.coerce.number().int().min(50).default(5000),
  MAIL_POLL_INTERVAL_MS: z.coerce.number().int().min(50).default(1000),
  /** First retry after an SMTP failure; doubles per attempt up to MAIL_RETRY_MAX_MS. */
  MAIL_RETRY_BASE_MS: z.coerce.number().int().min(10).default(5000),
  MAIL_RETRY_MAX_MS: z.coerce.number().int().min(10).default(300_000),
  /** The api runs queued backtests (one at a time per process); how often an idle worker looks for one. */
  BACKTEST_WORKERS: flag.default(true),
  BACKTEST_POLL_INTERVAL_MS: z.coerce.number().int().min(50).default(2000),
});

export type Config = Omit<z.infer<typeof ConfigSchema>, 'PUBLIC_URL'> & { PUBLIC_URL: string };

/** Parses the environment; a bad value stops start-up with every problem named. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = ConfigSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid configuration:\n${problems}`);
  }
  const config = parsed.data;
  return { ...config, PUBLIC_URL: config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}` };
}
