import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import {
  createLumpedModelSchema,
  lumpedModelParamsSchema,
  structureParamsSchema,
  updateLumpedModelSchema,
  type LumpedModelList,
} from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './lumped-models.service';

/**
 * /api/projects/:projectId/structures/:structureId/models: lumped (n-DOF) models with their undamped modes.
 * Everyone in the organisation reads; admins and engineers change.
 */
export function lumpedModelsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: structureParamsSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    const body: LumpedModelList = { models: await service.listLumpedModels(ctx.db, currentUser(req), projectId, structureId) };
    res.json(body);
  });

  router.post('/', editors, validate({ params: structureParamsSchema, body: createLumpedModelSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    const model = await service.createLumpedModel(ctx.db, currentUser(req), projectId, structureId, parsed(createLumpedModelSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/structures/${structureId}/models/${model.id}`).json(model);
  });

  router.get('/:modelId', validate({ params: lumpedModelParamsSchema }), async (req, res) => {
    const { projectId, structureId, modelId } = parsed(lumpedModelParamsSchema, req.params);
    res.json(await service.getLumpedModel(ctx.db, currentUser(req), projectId, structureId, modelId));
  });

  router.patch('/:modelId', editors, validate({ params: lumpedModelParamsSchema, body: updateLumpedModelSchema }), async (req, res) => {
    const { projectId, structureId, modelId } = parsed(lumpedModelParamsSchema, req.params);
    res.json(await service.updateLumpedModel(ctx.db, currentUser(req), projectId, structureId, modelId, parsed(updateLumpedModelSchema, req.body)));
  });

  router.delete('/:modelId', editors, validate({ params: lumpedModelParamsSchema }), async (req, res) => {
    const { projectId, structureId, modelId } = parsed(lumpedModelParamsSchema, req.params);
    await service.deleteLumpedModel(ctx.db, currentUser(req), projectId, structureId, modelId);
    res.status(204).end();
  });

  return router;
}
