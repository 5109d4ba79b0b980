import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { addProjectMemberSchema, userIdParamsSchema } from '../../../shared/contracts/members';
import { pageQuerySchema } from '../../../shared/contracts/paging';
import { projectIdParamsSchema } from '../../../shared/contracts/projects';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import * as service from './project-members.service';

const memberParamsSchema = projectIdParamsSchema.extend(userIdParamsSchema.shape);

/** /api/projects/:id/members: the project's people. Everyone in the organisation reads; admins and engineers change. */
export function projectMembersRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectIdParamsSchema, query: pageQuerySchema }), async (req, res) => {
    res.json(await service.listProjectMembers(ctx.db, currentUser(req), parsed(projectIdParamsSchema, req.params).id, parsed(pageQuerySchema, req.query)));
  });

  router.post('/', editors, validate({ params: projectIdParamsSchema, body: addProjectMemberSchema }), async (req, res) => {
    const { member, created } = await service.addProjectMember(ctx.db, currentUser(req), parsed(projectIdParamsSchema, req.params).id, req.body.userId);
    res.status(created ? 201 : 200).json(member);
  });

  router.delete('/:userId', editors, validate({ params: memberParamsSchema }), async (req, res) => {
    const params = parsed(memberParamsSchema, req.params);
    await service.removeProjectMember(ctx.db, currentUser(req), params.id, params.userId);
    res.status(204).end();
  });

  return router;
}
