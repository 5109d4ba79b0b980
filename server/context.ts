import type { ExpressAuthConfig } from '@auth/express';
import type pg from 'pg';
import type { Database } from './db/client';
import type { Env } from './env';
import type { FakeSmtp } from './mail/fake-smtp';
import type { Mailer } from './mail/mailer';
import type { OutboxRelay } from './mail/outbox';
import type { EnginePool } from './workers/engine-pool';

/** What the app's routers need, built once by the server (or by a test). */
export interface AppContext {
  env: Env;
  pool: pg.Pool;
  db: Database;
  mailer: Mailer;
  /** Sends the mail outbox after a commit and periodically, with retries. */
  outbox: OutboxRelay;
  /** The in-process fake SMTP server, when it runs (never in production). */
  fakeSmtp: FakeSmtp | null;
  authConfig: ExpressAuthConfig;
  /** Worker threads that run the numerical engine off the event loop. */
  enginePool: EnginePool;
}
