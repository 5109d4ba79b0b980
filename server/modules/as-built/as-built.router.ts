import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { asBuiltInputSchema, asBuiltParamsSchema, asBuiltRecorderRoles, type AsBuiltRecordList } from '../../../shared/contracts/as-built';
import * as service from './as-built.service';

/**
 * /api/projects/:projectId/sign-offs/:signOffId/as-built: everyone in the organisation reads the records of an approved
 * design with their comparison; admins, engineers and fabricators add one (owners and viewers: 403).
 */
export function asBuiltRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const recorders = requireRole(...asBuiltRecorderRoles);

  router.get('/', validate({ params: asBuiltParamsSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(asBuiltParamsSchema, req.params);
    const body: AsBuiltRecordList = { records: await service.listAsBuilt(ctx.db, currentUser(req), projectId, signOffId) };
    res.json(body);
  });

  router.post('/', recorders, validate({ params: asBuiltParamsSchema, body: asBuiltInputSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(asBuiltParamsSchema, req.params);
    const record = await service.recordAsBuilt(ctx.db, currentUser(req), projectId, signOffId, parsed(asBuiltInputSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/sign-offs/${signOffId}/as-built/${record.id}`).json(record);
  });

  return router;
}
