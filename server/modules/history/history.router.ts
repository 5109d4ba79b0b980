import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { historyParamsSchema, historyQuerySchema } from '../../../shared/contracts/history';
import * as service from './history.service';

/** /api/projects/:projectId/history: every role of the organisation reads; the database writes it (nobody else). */
export function historyRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get('/', validate({ params: historyParamsSchema, query: historyQuerySchema }), async (req, res) => {
    const { projectId } = parsed(historyParamsSchema, req.params);
    res.json(await service.listHistory(ctx.db, currentUser(req), projectId, parsed(historyQuerySchema, req.query)));
  });

  return router;
}
