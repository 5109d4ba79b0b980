import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { createLoadCaseSchema, loadCaseParamsSchema, projectParamsSchema, updateLoadCaseSchema, type LoadCaseList } from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './load-cases.service';

/** /api/projects/:projectId/load-cases: everyone in the organisation reads; admins and engineers change. */
export function loadCasesRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const body: LoadCaseList = { loadCases: await service.listLoadCases(ctx.db, currentUser(req), parsed(projectParamsSchema, req.params).projectId) };
    res.json(body);
  });

  router.post('/', editors, validate({ params: projectParamsSchema, body: createLoadCaseSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const loadCase = await service.createLoadCase(ctx.db, currentUser(req), projectId, parsed(createLoadCaseSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/load-cases/${loadCase.id}`).json(loadCase);
  });

  router.get('/:loadCaseId', validate({ params: loadCaseParamsSchema }), async (req, res) => {
    const { projectId, loadCaseId } = parsed(loadCaseParamsSchema, req.params);
    res.json(await service.getLoadCase(ctx.db, currentUser(req), projectId, loadCaseId));
  });

  router.patch('/:loadCaseId', editors, validate({ params: loadCaseParamsSchema, body: updateLoadCaseSchema }), async (req, res) => {
    const { projectId, loadCaseId } = parsed(loadCaseParamsSchema, req.params);
    res.json(await service.updateLoadCase(ctx.db, currentUser(req), projectId, loadCaseId, parsed(updateLoadCaseSchema, req.body)));
  });

  router.delete('/:loadCaseId', editors, validate({ params: loadCaseParamsSchema }), async (req, res) => {
    const { projectId, loadCaseId } = parsed(loadCaseParamsSchema, req.params);
    await service.deleteLoadCase(ctx.db, currentUser(req), projectId, loadCaseId);
    res.status(204).end();
  });

  return router;
}
