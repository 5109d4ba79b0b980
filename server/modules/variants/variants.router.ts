import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { projectParamsSchema } from '../../../shared/contracts/model';
import { projectEditorRoles } from '../../../shared/contracts/roles';
import {
  createVariantSchema,
  sizeVariantSchema,
  updateVariantSchema,
  variantCurvesQuerySchema,
  variantParamsSchema,
  type VariantList,
} from '../../../shared/contracts/variants';
import * as service from './variants.service';
import { getVariantReport, variantReportFileName } from './report.service';
import { variantReportPdf } from './report.pdf';

/** /api/projects/:projectId/variants: everyone in the organisation reads; admins and engineers change and size. */
export function variantsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const body: VariantList = { variants: await service.listVariants(ctx.db, ctx.enginePool, currentUser(req), parsed(projectParamsSchema, req.params).projectId) };
    res.json(body);
  });

  router.post('/', editors, validate({ params: projectParamsSchema, body: createVariantSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const variant = await service.createVariant(ctx.db, ctx.enginePool, currentUser(req), projectId, parsed(createVariantSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/variants/${variant.id}`).json(variant);
  });

  router.get('/:variantId', validate({ params: variantParamsSchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    res.json(await service.getVariant(ctx.db, ctx.enginePool, currentUser(req), projectId, variantId));
  });

  router.patch('/:variantId', editors, validate({ params: variantParamsSchema, body: updateVariantSchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    res.json(await service.updateVariant(ctx.db, ctx.enginePool, currentUser(req), projectId, variantId, parsed(updateVariantSchema, req.body)));
  });

  router.delete('/:variantId', editors, validate({ params: variantParamsSchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    await service.deleteVariant(ctx.db, currentUser(req), projectId, variantId);
    res.status(204).end();
  });

  router.post('/:variantId/size', editors, validate({ params: variantParamsSchema, body: sizeVariantSchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    res.json(await service.sizeVariant(ctx.db, ctx.enginePool, currentUser(req), projectId, variantId, parsed(sizeVariantSchema, req.body)));
  });

  router.get('/:variantId/curves', validate({ params: variantParamsSchema, query: variantCurvesQuerySchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    const { loadCaseId } = parsed(variantCurvesQuerySchema, req.query);
    res.json(await service.variantCurves(ctx.db, ctx.enginePool, currentUser(req), projectId, variantId, loadCaseId));
  });

  // The engineer's design report (PDF): everyone in the organisation reads it; 409 while the engine refuses the inputs.
  router.get('/:variantId/report.pdf', validate({ params: variantParamsSchema }), async (req, res) => {
    const { projectId, variantId } = parsed(variantParamsSchema, req.params);
    const report = await getVariantReport(ctx.db, ctx.enginePool, currentUser(req), projectId, variantId);
    res.attachment(variantReportFileName(report)).type('application/pdf').send(await variantReportPdf(report));
  });

  return router;
}
