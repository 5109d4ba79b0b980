/**
 * The server's one parsed environment. Nothing else in the server reads process.env.
 * A bad value stops start-up with a message naming the variable and the rule.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { z } from 'zod';
import { repoRoot } from './db/cluster';

const flag = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', 'on', 'off'], { error: 'must be one of 1, 0, true, false, yes, no, on, off' })
  .transform((value) => ['1', 'true', 'yes', 'on'].includes(value));

const port = (fallback: number) =>
  z.coerce.number({ error: 'must be a port number' }).int('must be a whole number').min(0, 'must be 0–65535').max(65535, 'must be 0–65535').default(fallback);

const rawEnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production'], { error: 'must be development, test or production' }).default('development'),
  PORT: port(3000),
  HOST: z.string().min(1).default('127.0.0.1'),
  TRUST_PROXY: z
    .string()
    .min(1)
    .default('loopback')
    // Express's `trust proxy`: true/false, a number of hops, or addresses/subnets and the names loopback, linklocal, uniquelocal.
    .transform((value): boolean | number | string => (value === 'true' ? true : value === 'false' ? false : /^\d+$/.test(value) ? Number(value) : value)),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'must be a postgres:// connection URL')
    .optional(),
  AUTH_SECRET: z.string().min(32, 'must be at least 32 characters (for example `openssl rand -hex 32`)').optional(),
  APP_URL: z.url('must be an absolute URL such as http://localhost:3000').optional(),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: port(2525),
  MAIL_FROM: z.string().min(3).default('Stillspan <no-reply@stillspan.test>'),
  STILLSPAN_FAKE_SMTP: flag.optional(),
  STILLSPAN_PG_PORT: port(54329),
  STILLSPAN_DATA_DIR: z.string().min(1).optional(),
  STILLSPAN_CLIENT_DIR: z.string().min(1).optional(),
  STILLSPAN_COMPUTE_THREADS: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(256).optional(),
  STILLSPAN_COMPUTE_TIMEOUT_S: z.coerce.number({ error: 'must be a number of seconds' }).positive('must be greater than 0').max(3600, 'must be at most 3600').default(30),
  STILLSPAN_COMPUTE_MAX_ANSWER_MB: z.coerce.number({ error: 'must be a number of megabytes' }).positive('must be greater than 0').max(512).default(16),
});

export interface Env {
  nodeEnv: 'development' | 'test' | 'production';
  isProduction: boolean;
  port: number;
  /** Interface the server listens on (127.0.0.1 unless HOST says otherwise). */
  host: string;
  /** Express `trust proxy`: which peers' X-Forwarded-For is believed for the client address. */
  trustProxy: boolean | number | string;
  databaseUrl: string;
  authSecret: string;
  appUrl: string;
  smtpHost: string;
  smtpPort: number;
  mailFrom: string;
  fakeSmtp: boolean;
  pgPort: number;
  dataDir: string;
  /** The built client the server serves (vite build output). */
  clientDir: string;
  /** Worker threads of the engine pool (default: the number of cores). */
  computeThreads: number | undefined;
  /** Time limit of one engine task. */
  computeTimeoutMs: number;
  /** Largest compute answer, in bytes of JSON. */
  computeMaxAnswerBytes: number;
}

export class EnvError extends Error {
  override name = 'EnvError';
}

/** Where `vite build` puts the client (vite.config.ts `build.outDir`). */
export const defaultClientDir = join(repoRoot, 'dist', 'client');

/** The project-local folder for generated secrets and the database (git-ignored). */
export const defaultDataDir = join(repoRoot, '.data');

/** Reads the development secret from the data folder, creating it on first use. */
function developmentSecret(dataDir: string): string {
  const file = join(dataDir, 'auth-secret');
  if (existsSync(file)) {
    const stored = readFileSync(file, 'utf8').trim();
    if (stored.length >= 32) return stored;
  }
  const secret = randomBytes(32).toString('hex');
  mkdirSync(dataDir, { recursive: true, mode: 0o755 });
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

/** Parses an environment (process.env by default). Throws EnvError listing every bad variable. */
export function parseEnv(source: Record<string, string | undefined> = process.env): Env {
  // An empty variable counts as unset.
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, value]) => value !== undefined && value !== ''));
  const parsed = rawEnvSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new EnvError(`Invalid environment:\n${lines.join('\n')}`);
  }
  const raw = parsed.data;
  const isProduction = raw.NODE_ENV === 'production';
  const problems: string[] = [];
  if (isProduction && !raw.AUTH_SECRET) problems.push('  AUTH_SECRET: is required in production (at least 32 characters)');
  if (isProduction && !raw.DATABASE_URL) problems.push('  DATABASE_URL: is required in production');
  if (isProduction && !raw.APP_URL) problems.push('  APP_URL: is required in production (the address people open, used in mailed links)');
  if (isProduction && raw.STILLSPAN_FAKE_SMTP) problems.push('  STILLSPAN_FAKE_SMTP: cannot be on in production');
  if (problems.length > 0) throw new EnvError(`Invalid environment:\n${problems.join('\n')}`);

  const dataDir = raw.STILLSPAN_DATA_DIR ?? defaultDataDir;
  return {
    nodeEnv: raw.NODE_ENV,
    isProduction,
    port: raw.PORT,
    host: raw.HOST,
    trustProxy: raw.TRUST_PROXY,
    databaseUrl: raw.DATABASE_URL ?? `postgres://postgres@127.0.0.1:${raw.STILLSPAN_PG_PORT}/stillspan`,
    authSecret: raw.AUTH_SECRET ?? developmentSecret(dataDir),
    appUrl: (raw.APP_URL ?? `http://localhost:${raw.PORT}`).replace(/\/+$/, ''),
    smtpHost: raw.SMTP_HOST,
    smtpPort: raw.SMTP_PORT,
    mailFrom: raw.MAIL_FROM,
    fakeSmtp: raw.STILLSPAN_FAKE_SMTP ?? !isProduction,
    pgPort: raw.STILLSPAN_PG_PORT,
    dataDir,
    clientDir: raw.STILLSPAN_CLIENT_DIR ? resolve(raw.STILLSPAN_CLIENT_DIR) : defaultClientDir,
    computeThreads: raw.STILLSPAN_COMPUTE_THREADS,
    computeTimeoutMs: Math.round(raw.STILLSPAN_COMPUTE_TIMEOUT_S * 1000),
    computeMaxAnswerBytes: Math.round(raw.STILLSPAN_COMPUTE_MAX_ANSWER_MB * 1e6),
  };
}

let cached: Env | undefined;

/** The process's environment, parsed once. */
export function getEnv(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** True when DATABASE_URL was given (then the start scripts use it instead of the project's own cluster). */
export function databaseUrlGiven(): boolean {
  return Boolean(process.env.DATABASE_URL);
}

/** True when APP_URL was given (else `npm run dev` points mailed links at the Vite dev server). */
export function appUrlGiven(): boolean {
  return Boolean(process.env.APP_URL);
}
