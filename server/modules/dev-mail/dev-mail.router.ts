import { Router } from 'express';
import type { FakeSmtp } from '../../mail/fake-smtp';
import type { DevMail } from '../../../shared/contracts/app-config';

/**
 * GET /api/dev/mail (never mounted in production): the mails the local fake SMTP server caught, newest first, so
 * that invitation links can be followed without a real mailbox. DELETE empties the list.
 */
export function devMailRouter(fakeSmtp: FakeSmtp): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    const body: { mails: DevMail[] } = { mails: fakeSmtp.mails() };
    res.json(body);
  });
  router.delete('/', (_req, res) => {
    fakeSmtp.clear();
    res.status(204).end();
  });
  return router;
}
