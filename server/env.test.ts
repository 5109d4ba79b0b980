import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { defaultClientDir, EnvError, parseEnv } from './env';

const dirs: string[] = [];
function dataDir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'stillspan-env-'));
  dirs.push(dir);
  return dir;
}
afterEach(() => {
  for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
});

describe('parseEnv', () => {
  it('gives the documented defaults in development', () => {
    const env = parseEnv({ STILLSPAN_DATA_DIR: dataDir() });
    expect(env).toMatchObject({
      nodeEnv: 'development',
      port: 3000,
      host: '127.0.0.1',
      trustProxy: 'loopback',
      computeTimeoutMs: 30_000,
      pgPort: 54329,
      databaseUrl: 'postgres://postgres@127.0.0.1:54329/stillspan',
      appUrl: 'http://localhost:3000',
      smtpHost: '127.0.0.1',
      smtpPort: 2525,
      fakeSmtp: true,
    });
  });

  it('generates a development secret once and keeps it in the data folder', () => {
    const dir = dataDir();
    const first = parseEnv({ STILLSPAN_DATA_DIR: dir }).authSecret;
    expect(first).toMatch(/^[0-9a-f]{64}$/);
    expect(readFileSync(join(dir, 'auth-secret'), 'utf8').trim()).toBe(first);
    expect(parseEnv({ STILLSPAN_DATA_DIR: dir }).authSecret).toBe(first);
  });

  it('follows STILLSPAN_PG_PORT and PORT, and strips a trailing slash from APP_URL', () => {
    const env = parseEnv({ STILLSPAN_DATA_DIR: dataDir(), STILLSPAN_PG_PORT: '55001', PORT: '4100', APP_URL: 'https://app.example/' });
    expect(env.databaseUrl).toBe('postgres://postgres@127.0.0.1:55001/stillspan');
    expect(env.port).toBe(4100);
    expect(env.appUrl).toBe('https://app.example');
  });

  it('serves the client from dist/client unless STILLSPAN_CLIENT_DIR names another folder', () => {
    expect(parseEnv({ STILLSPAN_DATA_DIR: dataDir() }).clientDir).toBe(defaultClientDir);
    const elsewhere = dataDir();
    expect(parseEnv({ STILLSPAN_DATA_DIR: dataDir(), STILLSPAN_CLIENT_DIR: elsewhere }).clientDir).toBe(elsewhere);
  });

  it('names the variable and the rule when a value is bad', () => {
    expect(() => parseEnv({ PORT: 'eighty' })).toThrow(EnvError);
    expect(() => parseEnv({ PORT: '70000' })).toThrow(/PORT: must be 0–65535/);
    expect(() => parseEnv({ NODE_ENV: 'staging' })).toThrow(/NODE_ENV: must be development, test or production/);
    expect(() => parseEnv({ DATABASE_URL: 'mysql://x' })).toThrow(/DATABASE_URL: must be a postgres:\/\/ connection URL/);
    expect(() => parseEnv({ STILLSPAN_FAKE_SMTP: 'maybe' })).toThrow(/STILLSPAN_FAKE_SMTP/);
  });

  it('requires a secret, a database and the public address in production, and no fake SMTP', () => {
    expect(() => parseEnv({ NODE_ENV: 'production' })).toThrow(/AUTH_SECRET: is required in production/);
    const complete = { NODE_ENV: 'production', AUTH_SECRET: 'p'.repeat(40), DATABASE_URL: 'postgres://u@db/stillspan', APP_URL: 'https://app.example' };
    expect(parseEnv(complete)).toMatchObject({ isProduction: true, fakeSmtp: false });
    expect(() => parseEnv({ ...complete, STILLSPAN_FAKE_SMTP: '1' })).toThrow(/STILLSPAN_FAKE_SMTP: cannot be on in production/);
    expect(() => parseEnv({ ...complete, AUTH_SECRET: 'short' })).toThrow(/AUTH_SECRET: must be at least 32 characters/);
  });
});
