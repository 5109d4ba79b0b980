import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import { createApp } from './app';
import { createAuthConfig } from './auth/config';
import type { AppContext } from './context';
import { applyMigrations, createDatabase, createPool } from './db/client';
import { seedDemoIfEmpty } from './db/seed';
import type { Env } from './env';
import { startFakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';
import { startOutboxRelay } from './mail/outbox';
import { createEnginePool } from './workers/engine-pool';

function log(line: string): void {
  process.stdout.write(`[stillspan] ${line}\n`);
}

export interface RunningServer {
  url: string;
  port: number;
  context: AppContext;
  close(): Promise<void>;
}

/** Builds everything the app needs (pool, migrations, demo seed, mail) without listening. */
export async function createContext(env: Env, options: { seed?: boolean } = {}): Promise<AppContext> {
  const pool = createPool(env.databaseUrl);
  const db = createDatabase(pool);
  try {
    await applyMigrations(db);
  } catch (error) {
    await pool.end();
    throw new Error(`Could not apply the database migrations to ${env.databaseUrl.replace(/:[^:@/]*@/, ':***@')}: ${(error as Error).message}`, { cause: error });
  }
  if ((options.seed ?? true) && !env.isProduction && (await seedDemoIfEmpty(db))) {
    log('the database was empty: seeded the invented demo organisation (password stillspan-demo)');
  }
  const fakeSmtp = env.fakeSmtp ? await startFakeSmtp({ host: '127.0.0.1', port: env.smtpPort, log }) : null;
  const mailer = fakeSmtp
    ? createMailer({ host: fakeSmtp.host, port: fakeSmtp.port, from: env.mailFrom, ignoreTls: true })
    : createMailer({ host: env.smtpHost, port: env.smtpPort, from: env.mailFrom });
  const enginePool = createEnginePool({ threads: env.computeThreads, taskTimeoutMs: env.computeTimeoutMs, maxAnswerBytes: env.computeMaxAnswerBytes });
  const outbox = startOutboxRelay(db, mailer, { periodMs: 30_000, log });
  return { env, pool, db, mailer, outbox, fakeSmtp, enginePool, authConfig: createAuthConfig({ db, secret: env.authSecret }) };
}

export async function closeContext(ctx: AppContext): Promise<void> {
  await ctx.outbox.stop();
  ctx.mailer.close();
  await ctx.enginePool.close();
  await ctx.fakeSmtp?.close();
  await ctx.pool.end();
}

/** Migrates, seeds, starts the mail catcher when asked, and listens on env.port. */
export async function startServer(env: Env): Promise<RunningServer> {
  const context = await createContext(env);
  const app = createApp(context, { clientDir: env.clientDir });
  const server: Server = createServer(app);
  await new Promise<void>((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(env.port, env.host, () => {
      server.off('error', reject);
      resolvePromise();
    });
  }).catch(async (error: NodeJS.ErrnoException) => {
    await closeContext(context);
    throw error.code === 'EADDRINUSE' ? new Error(`Port ${env.port} is taken: stop the other program or set PORT`) : error;
  });
  const port = (server.address() as AddressInfo).port;
  log(`serving on http://${env.host.includes(':') ? `[${env.host}]` : env.host}:${port} (${env.nodeEnv})`);
  if (context.fakeSmtp) log(`mails are caught by the fake SMTP server on 127.0.0.1:${context.fakeSmtp.port}; see /api/dev/mail`);
  let closing: Promise<void> | undefined;
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    context,
    close() {
      closing ??= (async () => {
        await new Promise<void>((resolvePromise) => {
          server.close(() => resolvePromise());
          server.closeIdleConnections();
          // Connections still busy after five seconds are cut.
          setTimeout(() => server.closeAllConnections(), 5000).unref();
        });
        await closeContext(context);
      })();
      return closing;
    },
  };
}
