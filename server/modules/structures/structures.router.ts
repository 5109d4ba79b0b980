import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import {
  createStructureSchema,
  projectParamsSchema,
  structureParamsSchema,
  updateStructureSchema,
  type StructureList,
} from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './structures.service';

/** /api/projects/:projectId/structures: everyone in the organisation reads; admins and engineers change. */
export function structuresRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const body: StructureList = { structures: await service.listStructures(ctx.db, currentUser(req), parsed(projectParamsSchema, req.params).projectId) };
    res.json(body);
  });

  router.post('/', editors, validate({ params: projectParamsSchema, body: createStructureSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const structure = await service.createStructure(ctx.db, currentUser(req), projectId, parsed(createStructureSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/structures/${structure.id}`).json(structure);
  });

  router.get('/:structureId', validate({ params: structureParamsSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    res.json(await service.getStructure(ctx.db, currentUser(req), projectId, structureId));
  });

  router.patch('/:structureId', editors, validate({ params: structureParamsSchema, body: updateStructureSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    res.json(await service.updateStructure(ctx.db, currentUser(req), projectId, structureId, parsed(updateStructureSchema, req.body)));
  });

  router.delete('/:structureId', editors, validate({ params: structureParamsSchema }), async (req, res) => {
    const { projectId, structureId } = parsed(structureParamsSchema, req.params);
    await service.deleteStructure(ctx.db, currentUser(req), projectId, structureId);
    res.status(204).end();
  });

  return router;
}
