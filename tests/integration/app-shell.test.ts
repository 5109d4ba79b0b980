/**
 * What the app serves beside the API routes: the built client with its client-side routes, JSON 404s under /api,
 * the development mailbox only outside production, and the production defaults of /api/config.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/context';
import { parseEnv } from '../../server/env';
import { closeContext, createContext } from '../../server/server';
import { createTestApp, signIn, signInDemoAdmin, type TestApp } from '../support/test-app';

let t: TestApp;
let clientDir: string;
let production: AppContext | undefined;

beforeAll(async () => {
  t = await createTestApp({ demo: true });
  clientDir = mkdtempSync(join(tmpdir(), 'stillspan-client-'));
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>client shell</title>');
  writeFileSync(join(clientDir, 'app.js'), 'console.log(1)');
});

afterAll(async () => {
  if (production) await closeContext(production);
  await t?.close();
  rmSync(clientDir, { recursive: true, force: true });
});

describe('serving the client', () => {
  it('serves files and answers client routes with index.html', async () => {
    const app = createApp(t.ctx, { clientDir });
    expect((await request(app).get('/app.js').expect(200)).text).toContain('console.log');
    for (const path of ['/', '/projects/123', '/invitations/some-token']) {
      const response = await request(app).get(path).expect(200);
      expect(response.text).toContain('client shell');
    }
  });

  it('sends the security headers with pages and API answers', async () => {
    const app = createApp(t.ctx, { clientDir });
    for (const path of ['/', '/api/health']) {
      const response = await request(app).get(path);
      expect(response.headers['x-content-type-options']).toBe('nosniff');
      expect(response.headers['x-frame-options']).toBe('DENY');
      expect(response.headers['referrer-policy']).toBe('same-origin');
      expect(response.headers['content-security-policy']).toContain("script-src 'self'");
    }
  });

  it('API answers are never cached (one Cache-Control for all of /api), the client shell is revalidated', async () => {
    const app = createApp(t.ctx, { clientDir });
    for (const path of ['/api/health', '/api/config', '/api/dev/mail', '/api/nothing-here']) {
      expect((await request(app).get(path)).headers['cache-control'], path).toBe('no-store');
    }
    expect((await request(app).get('/projects/123').expect(200)).headers['cache-control']).toBe('no-cache');
  });

  it('unknown /api paths get a JSON 404, never the client', async () => {
    const app = createApp(t.ctx, { clientDir });
    const response = await request(app).get('/api/nothing-here').expect(404);
    expect(response.body.error.code).toBe('not_found');
  });
});

describe('development mailbox', () => {
  it('is served outside production, to the demo organisation’s admin', async () => {
    const demoAdmin = await signInDemoAdmin(t.app);
    const response = await demoAdmin.get('/api/dev/mail').expect(200);
    expect(response.body).toEqual({ mails: [] });
  });

  it('is refused to anyone else: signed out 401, another organisation’s admin 403, from another address 404', async () => {
    expect((await request(t.app).get('/api/dev/mail').expect(401)).body.error.code).toBe('unauthenticated');
    await request(t.app).delete('/api/dev/mail').expect(401);
    const otherAdmin = await signIn(t.app, t.people.admin.email);
    expect((await otherAdmin.get('/api/dev/mail').expect(403)).body.error.code).toBe('forbidden');
    await otherAdmin.delete('/api/dev/mail').expect(403);
    // Through a proxy on this machine for a client elsewhere (X-Forwarded-For is believed from loopback).
    const demoAdmin = await signInDemoAdmin(t.app);
    await demoAdmin.get('/api/dev/mail').set('X-Forwarded-For', '203.0.113.9').expect(404);
  });

  it('does not exist in production, and /api/config lists no demo accounts there', async () => {
    const env = parseEnv({
      NODE_ENV: 'production',
      DATABASE_URL: t.databaseUrl,
      AUTH_SECRET: 'production-secret-0123456789abcdef0123456789',
      APP_URL: 'https://stillspan.example',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: '1',
    });
    production = await createContext(env);
    expect(production.fakeSmtp).toBeNull();
    const app = createApp(production, { clientDir: null });
    await request(app).get('/api/dev/mail').expect(404);
    expect((await request(app).get('/api/config').expect(200)).body).toEqual({ mode: 'production', demoAccounts: [], demoPassword: null, devMailbox: false });
  });
});
