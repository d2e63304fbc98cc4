import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

/** The project root: two levels up from both `server/` and `dist/server/`. */
export const projectRoot = path.resolve(__dirname, __dirname.includes(`${path.sep}dist${path.sep}`) ? '../..' : '..');

const port = z.coerce.number().int().min(1).max(65535);
const timeZone = z.string().refine((tz) => {
  try {
    new Intl.DateTimeFormat('en-CA', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}, 'is not an IANA time zone');

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port.default(3000),
  DATABASE_URL: z.string().optional(),
  PGHOST: z.string().default('127.0.0.1'),
  PGPORT: port.default(54329),
  PGUSER: z.string().default('padside'),
  PGPASSWORD: z.string().optional(),
  PGDATABASE: z.string().default('padside'),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  SMTP_URL: z.url().default('smtp://127.0.0.1:1025'),
  MAIL_FROM: z.string().default('Padside <hello@padside.test>'),
  MAIL_POLL_MS: z.coerce.number().int().min(100).default(2000),
  STRIPE_SECRET_KEY: z.string().default('sk_test_padside_local'),
  STRIPE_API_BASE: z.url().default('http://127.0.0.1:12111'),
  STRIPE_WEBHOOK_SECRET: z.string().default('whsec_padside_local_development'),
  STRIPE_PUBLISHABLE_KEY: z
    .string()
    .regex(/^pk_(test|live)_[A-Za-z0-9]+$/, 'must be a publishable key (pk_test_… or pk_live_…)')
    .optional(),
  PUBLIC_URL: z.url().default('http://127.0.0.1:3000'),
  CLUB_TIME_ZONE: timeZone.default('America/Winnipeg'),
  // The demo scenario's names outside production; a real team sets its own (required there).
  TEAM_NAME: z.string().trim().min(1).max(80).optional(),
  CLUB_NAME: z.string().trim().min(1).max(120).optional(),
  DATA_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  WORKERS: z.coerce.number().int().min(1).max(64).default(1),
  BROWSER_DIST: z.string().optional(),
  // Unset: uploads on the local disk. `s3://bucket/prefix`: an S3-compatible object store (several machines).
  STORAGE_URL: z
    .string()
    .regex(
      /^s3:\/\/[a-z0-9][a-z0-9.-]{1,61}[a-z0-9](\/[A-Za-z0-9!_.*'()/-]*)?$/,
      'must look like s3://bucket or s3://bucket/prefix (bucket: 3 to 63 lower-case letters, digits, dots and hyphens)',
    )
    .optional(),
  S3_ENDPOINT: z.url({ protocol: /^https?$/, error: 'must be an http(s) URL' }).optional(),
  S3_REGION: z
    .string()
    .trim()
    .regex(/^[a-z0-9-]{2,40}$/, 'must be a region name such as us-east-1')
    .optional(),
  S3_ACCESS_KEY_ID: z.string().trim().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false', '1', '0'], { error: 'must be true or false' }).default('false'),
});

/** Where uploaded images live: a folder on this machine, or a bucket every machine shares. */
export type StorageConfig =
  | { kind: 'disk'; dir: string }
  | {
      kind: 's3';
      bucket: string;
      prefix: string;
      endpoint: string;
      region: string;
      accessKeyId: string;
      secretAccessKey: string;
      forcePathStyle: boolean;
    };

export interface Config {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  smtpUrl: string;
  mailFrom: string;
  mailPollMs: number;
  /** `publishableKey` switches the payment step from labelled test tokens to Stripe.js card entry. */
  stripe: { secretKey: string; apiBase: string; webhookSecret: string; publishableKey: string | null };
  publicUrl: string;
  clubTimeZone: string;
  /** The maker team that sells, credits and signs mail, and the club members fly with. */
  site: { teamName: string; clubName: string };
  dataDir: string;
  logLevel: string;
  workers: number;
  /** The built Angular app that the server serves. */
  browserDist: string;
  storage: StorageConfig;
}

/** Thrown when the environment is unusable; `main` prints the message as one line and exits 1. */
export class ConfigError extends Error {}

/** Reads and validates the environment once; development gets working defaults. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ConfigError(`Padside: ${String(issue.path[0])} ${issue.message}`);
  }
  const e = parsed.data;
  const dataDir = path.resolve(projectRoot, e.DATA_DIR ?? '.data');
  const databaseUrl =
    e.DATABASE_URL ??
    `postgres://${encodeURIComponent(e.PGUSER)}${e.PGPASSWORD ? ':' + encodeURIComponent(e.PGPASSWORD) : ''}@${e.PGHOST}:${e.PGPORT}/${encodeURIComponent(e.PGDATABASE)}`;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET)
    throw new ConfigError('Padside: SESSION_SECRET is required in production');
  if (e.NODE_ENV === 'production' && e.STRIPE_WEBHOOK_SECRET.startsWith('whsec_padside_local')) {
    throw new ConfigError('Padside: STRIPE_WEBHOOK_SECRET must be set in production');
  }
  if (e.NODE_ENV === 'production' && (!e.TEAM_NAME || !e.CLUB_NAME))
    throw new ConfigError('Padside: TEAM_NAME and CLUB_NAME are required in production');
  // Test tokens only work against a test account or the fake; the real API needs real card entry.
  if (/^https:\/\/api\.stripe\.com\/?$/.test(e.STRIPE_API_BASE) && !e.STRIPE_PUBLISHABLE_KEY)
    throw new ConfigError('Padside: STRIPE_PUBLISHABLE_KEY is required when STRIPE_API_BASE is the processor itself');
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl,
    sessionSecret: e.SESSION_SECRET ?? developmentSessionSecret(dataDir),
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    mailPollMs: e.MAIL_POLL_MS,
    stripe: {
      secretKey: e.STRIPE_SECRET_KEY,
      apiBase: e.STRIPE_API_BASE,
      webhookSecret: e.STRIPE_WEBHOOK_SECRET,
      publishableKey: e.STRIPE_PUBLISHABLE_KEY ?? null,
    },
    publicUrl: e.PUBLIC_URL.replace(/\/$/, ''),
    clubTimeZone: e.CLUB_TIME_ZONE,
    site: { teamName: e.TEAM_NAME ?? 'Thrust & Filament', clubName: e.CLUB_NAME ?? 'Gopher Flats Rocketry Society' },
    dataDir,
    logLevel: e.LOG_LEVEL,
    workers: e.WORKERS,
    browserDist: e.BROWSER_DIST ? path.resolve(e.BROWSER_DIST) : path.join(projectRoot, 'dist', 'padside', 'browser'),
    storage: storageConfig(e, dataDir),
  };
}

/** The disk unless STORAGE_URL names a bucket; then every S3 setting it needs must be there. */
function storageConfig(e: z.infer<typeof EnvSchema>, dataDir: string): StorageConfig {
  if (!e.STORAGE_URL) return { kind: 'disk', dir: path.join(dataDir, 'uploads') };
  const missing = (['S3_ENDPOINT', 'S3_REGION', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const).filter(
    (k) => !e[k],
  );
  if (missing.length)
    throw new ConfigError(
      `Padside: ${missing.join(', ')} ${missing.length > 1 ? 'are' : 'is'} required when STORAGE_URL is set`,
    );
  const [, bucket, rest = ''] = /^s3:\/\/([^/]+)\/?(.*)$/.exec(e.STORAGE_URL)!;
  if (bucket.includes('..') || /^\d+\.\d+\.\d+\.\d+$/.test(bucket))
    throw new ConfigError('Padside: STORAGE_URL names a bucket that S3 does not allow (no "..", not an IP address)');
  const prefix = rest.replace(/\/+$/, '');
  return {
    kind: 's3',
    bucket,
    prefix: prefix ? `${prefix}/` : '',
    endpoint: e.S3_ENDPOINT!.replace(/\/$/, ''),
    region: e.S3_REGION!,
    accessKeyId: e.S3_ACCESS_KEY_ID!,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY!,
    forcePathStyle: e.S3_FORCE_PATH_STYLE === 'true' || e.S3_FORCE_PATH_STYLE === '1',
  };
}

/** Generated once per checkout so development sessions survive restarts without a secret in the repo. */
function developmentSessionSecret(dataDir: string): string {
  const file = path.join(dataDir, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
