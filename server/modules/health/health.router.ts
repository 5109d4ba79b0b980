import { Router } from 'express';
import type pg from 'pg';
import type { Health } from '../../../shared/contracts/health';

/** Answers within about two seconds whether the database takes queries. */
export async function databaseReachable(pool: pg.Pool, timeoutMs = 2000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<boolean>((resolvePromise) => {
    timer = setTimeout(() => resolvePromise(false), timeoutMs);
  });
  const probe = pool.query('SELECT 1').then(
    () => true,
    () => false,
  );
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** GET /api/health (public): 200 when the database answers, 503 when it does not. */
export function healthRouter(pool: pg.Pool): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const up = await databaseReachable(pool);
    const body: Health = up ? { status: 'ok', database: 'ok' } : { status: 'degraded', database: 'down' };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
