import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { pageQuerySchema } from '../../../shared/contracts/paging';
import { createProjectSchema, projectIdParamsSchema, updateProjectSchema } from '../../../shared/contracts/projects';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './projects.service';

/** /api/projects: every member of the organisation reads; admins and engineers create, change and delete. */
export function projectsRouter(ctx: AppContext): Router {
  const router = Router();
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await service.listProjects(ctx.db, currentUser(req), parsed(pageQuerySchema, req.query)));
  });

  router.post('/', editors, validate({ body: createProjectSchema }), async (req, res) => {
    const project = await service.createProject(ctx.db, currentUser(req), req.body);
    res.status(201).location(`/api/projects/${project.id}`).json(project);
  });

  router.get('/:id', validate({ params: projectIdParamsSchema }), async (req, res) => {
    res.json(await service.getProject(ctx.db, currentUser(req), parsed(projectIdParamsSchema, req.params).id));
  });

  router.patch('/:id', editors, validate({ params: projectIdParamsSchema, body: updateProjectSchema }), async (req, res) => {
    res.json(await service.updateProject(ctx.db, currentUser(req), parsed(projectIdParamsSchema, req.params).id, req.body));
  });

  router.delete('/:id', editors, validate({ params: projectIdParamsSchema }), async (req, res) => {
    await service.deleteProject(ctx.db, currentUser(req), parsed(projectIdParamsSchema, req.params).id);
    res.status(204).end();
  });

  return router;
}
