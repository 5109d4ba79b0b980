import { Router } from 'express';
import type { AppContext } from '../../context';
import { demoAccounts, demoPassword } from '../../db/seed';
import type { AppConfig } from '../../../shared/contracts/app-config';

/** GET /api/config (public): how this server runs, and outside production the demo accounts. */
export function configRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    const body: AppConfig = {
      mode: ctx.env.nodeEnv,
      demoAccounts: ctx.env.isProduction ? [] : demoAccounts.map(({ email, role }) => ({ email, role })),
      demoPassword: ctx.env.isProduction ? null : demoPassword,
      devMailbox: !ctx.env.isProduction && ctx.fakeSmtp !== null,
    };
    res.json(body);
  });
  return router;
}
