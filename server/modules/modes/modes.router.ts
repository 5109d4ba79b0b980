import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { createModeSchema, modeParamsSchema, structureParamsSchema, updateModeSchema, type ModeList } from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './modes.service';

/** /api/projects/:projectId/structures/:structureId/modes: everyone in the organisation reads; admins and engineers change. */
export function modesRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: structureParamsSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    const body: ModeList = { modes: await service.listModes(ctx.db, currentUser(req), projectId, structureId) };
    res.json(body);
  });

  router.post('/', editors, validate({ params: structureParamsSchema, body: createModeSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    const mode = await service.createMode(ctx.db, currentUser(req), projectId, structureId, parsed(createModeSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/structures/${structureId}/modes/${mode.id}`).json(mode);
  });

  router.get('/:modeId', validate({ params: modeParamsSchema }), async (req, res) => {
    const { projectId, structureId, modeId } = parsed(modeParamsSchema, req.params);
    res.json(await service.getMode(ctx.db, currentUser(req), projectId, structureId, modeId));
  });

  router.patch('/:modeId', editors, validate({ params: modeParamsSchema, body: updateModeSchema }), async (req, res) => {
    const { projectId, structureId, modeId } = parsed(modeParamsSchema, req.params);
    res.json(await service.updateMode(ctx.db, currentUser(req), projectId, structureId, modeId, parsed(updateModeSchema, req.body)));
  });

  router.delete('/:modeId', editors, validate({ params: modeParamsSchema }), async (req, res) => {
    const { projectId, structureId, modeId } = parsed(modeParamsSchema, req.params);
    await service.deleteMode(ctx.db, currentUser(req), projectId, structureId, modeId);
    res.status(204).end();
  });

  return router;
}
