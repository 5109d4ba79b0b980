import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import {
  comfortCriteriaParamsSchema,
  createComfortCriteriaSchema,
  projectParamsSchema,
  updateComfortCriteriaSchema,
  type ComfortCriteriaList,
} from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './comfort-criteria.service';

/**
 * /api/projects/:projectId/comfort-criteria: everyone in the organisation reads; admins and engineers change name
 * and spec. The status (draft, submitted, approved, returned) belongs to sign-off and cannot be set here.
 */
export function comfortCriteriaRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const body: ComfortCriteriaList = {
      comfortCriteria: await service.listComfortCriteria(ctx.db, currentUser(req), parsed(projectParamsSchema, req.params).projectId),
    };
    res.json(body);
  });

  router.post('/', editors, validate({ params: projectParamsSchema, body: createComfortCriteriaSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const criteria = await service.createComfortCriteria(ctx.db, currentUser(req), projectId, parsed(createComfortCriteriaSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/comfort-criteria/${criteria.id}`).json(criteria);
  });

  router.get('/:criteriaId', validate({ params: comfortCriteriaParamsSchema }), async (req, res) => {
    const { projectId, criteriaId } = parsed(comfortCriteriaParamsSchema, req.params);
    res.json(await service.getComfortCriteria(ctx.db, currentUser(req), projectId, criteriaId));
  });

  router.patch('/:criteriaId', editors, validate({ params: comfortCriteriaParamsSchema, body: updateComfortCriteriaSchema }), async (req, res) => {
    const { projectId, criteriaId } = parsed(comfortCriteriaParamsSchema, req.params);
    res.json(await service.updateComfortCriteria(ctx.db, currentUser(req), projectId, criteriaId, parsed(updateComfortCriteriaSchema, req.body)));
  });

  router.delete('/:criteriaId', editors, validate({ params: comfortCriteriaParamsSchema }), async (req, res) => {
    const { projectId, criteriaId } = parsed(comfortCriteriaParamsSchema, req.params);
    await service.deleteComfortCriteria(ctx.db, currentUser(req), projectId, criteriaId);
    res.status(204).end();
  });

  return router;
}
