import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import {
  acceptInvitationSchema,
  createInvitationSchema,
  invitationIdParamsSchema,
  invitationTokenParamsSchema,
  updateMemberRoleSchema,
  userIdParamsSchema,
} from '../../../shared/contracts/members';
import { pageQuerySchema } from '../../../shared/contracts/paging';
import { memberManagerRoles } from '../../../shared/contracts/roles';
import * as service from './members.service';

/**
 * /api/organisation: the organisation's people and invitations, admins only (requireUser runs before) — except
 * GET /people, the read-only list of members that everyone in the organisation may see.
 */
export function organisationRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/people', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await service.listPeople(ctx.db, currentUser(req), parsed(pageQuerySchema, req.query)));
  });

  router.use(requireRole(...memberManagerRoles));

  router.get('/members', validate({ query: pageQuerySchema }), async (req, res) => {
    res.json(await service.listMembers(ctx.db, currentUser(req), parsed(pageQuerySchema, req.query)));
  });

  const invite = async (req: Request, res: Response) => {
    res.status(201).json(await service.invite(ctx, currentUser(req), req.body));
  };
  router.post('/members', validate({ body: createInvitationSchema }), invite);
  router.post('/invitations', validate({ body: createInvitationSchema }), invite);

  router.patch('/members/:userId', validate({ params: userIdParamsSchema, body: updateMemberRoleSchema }), async (req, res) => {
    res.json(await service.changeMemberRole(ctx.db, currentUser(req), parsed(userIdParamsSchema, req.params).userId, req.body.role));
  });

  router.delete('/members/:userId', validate({ params: userIdParamsSchema }), async (req, res) => {
    await service.removeMember(ctx.db, currentUser(req), parsed(userIdParamsSchema, req.params).userId);
    res.status(204).end();
  });

  router.delete('/invitations/:id', validate({ params: invitationIdParamsSchema }), async (req, res) => {
    await service.withdrawInvitation(ctx.db, currentUser(req), parsed(invitationIdParamsSchema, req.params).id);
    res.status(204).end();
  });

  return router;
}

/** /api/invitations/:token: public, the token is the proof. Accepting creates the account; it signs nobody in. */
export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/:token', validate({ params: invitationTokenParamsSchema }), async (req, res) => {
    res.json(await service.previewInvitation(ctx.db, parsed(invitationTokenParamsSchema, req.params).token));
  });

  router.post('/:token/accept', validate({ params: invitationTokenParamsSchema, body: acceptInvitationSchema }), async (req, res) => {
    res.status(201).json(await service.acceptInvitation(ctx.db, parsed(invitationTokenParamsSchema, req.params).token, req.body));
  });

  return router;
}
