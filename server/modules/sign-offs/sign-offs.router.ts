import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { projectParamsSchema } from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import {
  approveSignOffSchema,
  returnSignOffSchema,
  signOffParamsSchema,
  submitSignOffSchema,
  type SignOffList,
} from '../../../shared/contracts/sign-offs';
import * as service from './sign-offs.service';
import { getHardwareSheet, hardwareSheetFileName } from './hardware-sheet.service';
import { hardwareSheetPdf } from './hardware-sheet.pdf';
import { hardwareSheetCsv } from '../../../shared/compute/hardware-sheet';

/**
 * /api/projects/:projectId/sign-offs: everyone in the organisation reads; admins and engineers submit; only owners
 * approve or return (the submitter included when they are not an owner: 403).
 */
export function signOffsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const submitters = requireRole(...projectEditorRoles);
  const deciders = requireRole('owner');

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const body: SignOffList = { signOffs: await service.listSignOffs(ctx.db, currentUser(req), parsed(projectParamsSchema, req.params).projectId) };
    res.json(body);
  });

  router.post('/', submitters, validate({ params: projectParamsSchema, body: submitSignOffSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const signOff = await service.submitSignOff(ctx, currentUser(req), projectId, parsed(submitSignOffSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/sign-offs/${signOff.id}`).json(signOff);
  });

  router.get('/:signOffId', validate({ params: signOffParamsSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    res.json(await service.getSignOff(ctx.db, currentUser(req), projectId, signOffId));
  });

  // The fabricator's hardware sheet of an approved sign-off (409 before approval): rows as JSON, CSV and PDF.
  router.get('/:signOffId/hardware-sheet', validate({ params: signOffParamsSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    res.json(await getHardwareSheet(ctx.db, currentUser(req), projectId, signOffId));
  });

  router.get('/:signOffId/hardware-sheet.csv', validate({ params: signOffParamsSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    const sheet = await getHardwareSheet(ctx.db, currentUser(req), projectId, signOffId);
    res.attachment(hardwareSheetFileName(sheet, 'csv')).type('text/csv; charset=utf-8').send(hardwareSheetCsv(sheet));
  });

  router.get('/:signOffId/hardware-sheet.pdf', validate({ params: signOffParamsSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    const sheet = await getHardwareSheet(ctx.db, currentUser(req), projectId, signOffId);
    res.attachment(hardwareSheetFileName(sheet, 'pdf')).type('application/pdf').send(await hardwareSheetPdf(sheet));
  });

  router.post('/:signOffId/approve', deciders, validate({ params: signOffParamsSchema, body: approveSignOffSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    res.json(await service.approveSignOff(ctx, currentUser(req), projectId, signOffId, parsed(approveSignOffSchema, req.body)));
  });

  router.post('/:signOffId/return', deciders, validate({ params: signOffParamsSchema, body: returnSignOffSchema }), async (req, res) => {
    const { projectId, signOffId } = parsed(signOffParamsSchema, req.params);
    res.json(await service.returnSignOff(ctx, currentUser(req), projectId, signOffId, parsed(returnSignOffSchema, req.body)));
  });

  return router;
}
