import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { AppContext } from '../../context';
import { HttpError } from '../../lib/http-error';
import { currentUser, requireRole } from '../../middleware/auth';
import { parsed, validate } from '../../middleware/validate';
import { projectParamsSchema } from '../../../shared/contracts/model';
import { projectEditorRoles, type Role } from '../../../shared/contracts/roles';
import {
  analyseSiteRecordSchema,
  retunedVariantRequestSchema,
  retuneRequestSchema,
  SITE_RECORD_MAX_FILE_BYTES,
  siteRecordParamsSchema,
  uploadSiteRecordFieldsSchema,
  type SiteRecordList,
} from '../../../shared/contracts/site-records';
import * as service from './site-records.service';

/** Who may upload a record: the engineers, and the fabricator who measures on site. */
export const siteRecordUploaderRoles: readonly Role[] = ['admin', 'engineer', 'fabricator'];

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: SITE_RECORD_MAX_FILE_BYTES, files: 1, fields: 20, fieldSize: 64 * 1024 },
}).single('file');

/** multer with its refusals in the API's error shape: 413 for a file over the limit, 400 naming the field otherwise. */
const receiveFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    next(new HttpError(415, 'unsupported_media_type', 'Send the record as multipart/form-data with the CSV in the field "file"'));
    return;
  }
  upload(req, res, (error: unknown) => {
    if (error instanceof multer.MulterError) {
      if (error.code === 'LIMIT_FILE_SIZE') {
        const message = `file: is larger than ${SITE_RECORD_MAX_FILE_BYTES / (1024 * 1024)} MB`;
        next(new HttpError(413, 'payload_too_large', message, [{ path: 'file', message }]));
        return;
      }
      const path = error.field ?? 'file';
      const message = `${path}: ${error.message}`;
      next(new HttpError(400, 'invalid_request', message, [{ path, message }]));
      return;
    }
    next(error as Error | undefined);
  });
};

/** /api/projects/:projectId/site-records: everyone in the organisation reads (and may ask for a re-tune, which stores nothing); uploaders add and analyse again; admins and engineers create a re-tuned variant and delete. */
export function siteRecordsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  const uploaders = requireRole(...siteRecordUploaderRoles);
  const editors = requireRole(...projectEditorRoles);

  router.get('/', validate({ params: projectParamsSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const body: SiteRecordList = { siteRecords: await service.listSiteRecords(ctx.db, currentUser(req), projectId) };
    res.json(body);
  });

  router.post('/', uploaders, validate({ params: projectParamsSchema }), receiveFile, validate({ body: uploadSiteRecordFieldsSchema }), async (req, res) => {
    const { projectId } = parsed(projectParamsSchema, req.params);
    const file = req.file ? { originalName: req.file.originalname, buffer: req.file.buffer } : undefined;
    const record = await service.uploadSiteRecord(ctx.db, ctx.enginePool, currentUser(req), projectId, parsed(uploadSiteRecordFieldsSchema, req.body), file);
    res.status(201).location(`/api/projects/${projectId}/site-records/${record.id}`).json(record);
  });

  router.get('/:siteRecordId', validate({ params: siteRecordParamsSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    res.json(await service.getSiteRecord(ctx.db, currentUser(req), projectId, siteRecordId));
  });

  router.get('/:siteRecordId/time-history', validate({ params: siteRecordParamsSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    res.json(await service.getSiteRecordTimeHistory(ctx.db, currentUser(req), projectId, siteRecordId));
  });

  router.post('/:siteRecordId/analyse', uploaders, validate({ params: siteRecordParamsSchema, body: analyseSiteRecordSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    res.json(await service.reanalyseSiteRecord(ctx.db, ctx.enginePool, currentUser(req), projectId, siteRecordId, parsed(analyseSiteRecordSchema, req.body)));
  });

  // A calculation from the stored record: nothing is stored, so every reader may ask.
  router.post('/:siteRecordId/retune', validate({ params: siteRecordParamsSchema, body: retuneRequestSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    res.json(await service.retuneFromSiteRecord(ctx.db, currentUser(req), projectId, siteRecordId, parsed(retuneRequestSchema, req.body)));
  });

  // A new tuning variant: the variant's damper re-tuned to the measured structure, so only those who change variants.
  router.post('/:siteRecordId/retuned-variant', editors, validate({ params: siteRecordParamsSchema, body: retunedVariantRequestSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    const variant = await service.createRetunedVariant(ctx.db, ctx.enginePool, currentUser(req), projectId, siteRecordId, parsed(retunedVariantRequestSchema, req.body));
    res.status(201).location(`/api/projects/${projectId}/variants/${variant.id}`).json(variant);
  });

  router.delete('/:siteRecordId', editors, validate({ params: siteRecordParamsSchema }), async (req, res) => {
    const { projectId, siteRecordId } = parsed(siteRecordParamsSchema, req.params);
    await service.deleteSiteRecord(ctx.db, currentUser(req), projectId, siteRecordId);
    res.status(204).end();
  });

  return router;
}
