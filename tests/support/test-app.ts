/**
 * The application under test, on a database of its own cloned from the migrated template, with the in-process
 * fake SMTP server on a free port. Also the people every integration test works with: organisation A with one
 * person per role, and organisation B with an engineer and a project of its own.
 */
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import pg from 'pg';
import request from 'supertest';
import { expect, inject } from 'vitest';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/auth/password';
import type { AppContext } from '../../server/context';
import { memberships, organisations, projects, users } from '../../server/db/schema';
import { demoAccounts, demoPassword } from '../../server/db/seed';
import { parseEnv } from '../../server/env';
import { closeContext, createContext } from '../../server/server';
import type { Role } from '../../shared/contracts/roles';
import { clusterUrl, ensureDatabase } from './pg-cluster';

export const testPassword = 'integration-password-1';
export const appUrl = 'http://stillspan.test';

export interface Person {
  id: string;
  email: string;
  role: Role;
}

export interface TestApp {
  app: Express;
  ctx: AppContext;
  databaseUrl: string;
  /** Organisation A: one person per role. */
  people: Record<Role, Person>;
  organisationA: string;
  /** Organisation B: an engineer and one project that nobody in A may see. */
  outsider: Person;
  organisationB: string;
  outsiderProjectId: string;
  close(): Promise<void>;
}

/** Drops a test file's database (after its pool is closed). */
export async function dropDatabase(port: number, name: string): Promise<void> {
  const client = new pg.Client({ connectionString: clusterUrl(port, 'postgres') });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

/** Environment of the app under test: test mode, a fixed secret, the fake SMTP server on a free port. */
export function testEnv(databaseUrl: string, overrides: Record<string, string> = {}) {
  return parseEnv({
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    AUTH_SECRET: 'integration-secret-0123456789abcdef0123456789',
    APP_URL: appUrl,
    STILLSPAN_FAKE_SMTP: '1',
    SMTP_PORT: '0',
    ...overrides,
  });
}

/**
 * `env`: environment variables beside the test defaults (e.g. a short STILLSPAN_COMPUTE_TIMEOUT_S). `demo`: seed the
 * invented demo organisation first (its admin, admin@demo.stillspan.test, is the one who may read the mailbox).
 */
export async function createTestApp(options: { env?: Record<string, string>; demo?: boolean } = {}): Promise<TestApp> {
  const port = inject('pgPort');
  const name = `test_${randomUUID().replace(/-/g, '')}`;
  await ensureDatabase(port, name, inject('pgTemplate'));
  const databaseUrl = clusterUrl(port, name);
  const ctx = await createContext(testEnv(databaseUrl, options.env), { seed: options.demo ?? false });
  const { db } = ctx;

  const passwordHash = await hashPassword(testPassword, 4);
  const [orgA, orgB] = await db
    .insert(organisations)
    .values([{ name: 'Test organisation A' }, { name: 'Test organisation B' }])
    .returning();
  const roles: Role[] = ['admin', 'engineer', 'owner', 'fabricator', 'viewer'];
  const rows = await db
    .insert(users)
    .values([...roles.map((role) => ({ email: `${role}@a.test`, name: `A ${role}`, passwordHash })), { email: 'engineer@b.test', name: 'B engineer', passwordHash }])
    .returning({ id: users.id, email: users.email });
  const people = Object.fromEntries(roles.map((role, i) => [role, { id: rows[i].id, email: rows[i].email, role }])) as Record<Role, Person>;
  const outsider: Person = { id: rows[5].id, email: rows[5].email, role: 'engineer' };
  await db.insert(memberships).values([
    ...roles.map((role) => ({ organisationId: orgA.id, userId: people[role].id, role })),
    { organisationId: orgB.id, userId: outsider.id, role: 'engineer' as const },
  ]);
  const [outsiderProject] = await db
    .insert(projects)
    .values({ organisationId: orgB.id, name: 'B private footbridge', kind: 'footbridge', createdBy: outsider.id })
    .returning();

  return {
    app: createApp(ctx, { clientDir: null }),
    ctx,
    databaseUrl,
    people,
    organisationA: orgA.id,
    outsider,
    organisationB: orgB.id,
    outsiderProjectId: outsiderProject.id,
    async close() {
      await closeContext(ctx);
      await dropDatabase(port, name);
    },
  };
}

/**
 * One sign-in attempt through the real Auth.js endpoints (csrf → callback/credentials) on a fresh cookie jar, with
 * no expectation about the outcome: the agent and the answer to the credentials post.
 */
export async function attemptSignIn(app: Express, email: string, password: string, headers: Record<string, string> = {}) {
  const agent = request.agent(app);
  const csrf = await agent.get('/api/auth/csrf').expect(200);
  const csrfToken = (csrf.body as { csrfToken: string }).csrfToken;
  expect(csrfToken).toMatch(/^[0-9a-f]{32,}$/);
  const response = await agent.post('/api/auth/callback/credentials').set(headers).type('form').send({ csrfToken, email, password });
  return { agent, response };
}

/** Signs in (attemptSignIn) and checks that it worked; returns the agent holding the session cookie. */
export async function signIn(app: Express, email: string, password = testPassword) {
  const { agent, response } = await attemptSignIn(app, email, password);
  expect(response.status).toBe(302);
  expect(response.headers.location).not.toContain('error=');
  const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  expect(cookies.some((cookie) => cookie.startsWith('authjs.session-token='))).toBe(true);
  return agent;
}

export type Agent = Awaited<ReturnType<typeof signIn>>;

/** Signs in as the demo organisation's admin (createTestApp({ demo: true })), who may read the development mailbox. */
export function signInDemoAdmin(app: Express) {
  return signIn(app, demoAccounts[0].email, demoPassword);
}
