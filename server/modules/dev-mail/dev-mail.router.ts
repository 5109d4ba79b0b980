import { Router, type RequestHandler } from 'express';
import { isIP } from 'node:net';
import { demoOrganisationName } from '../../db/seed';
import { HttpError } from '../../lib/http-error';
import type { FakeSmtp } from '../../mail/fake-smtp';
import { currentUser } from '../../middleware/auth';
import type { DevMail } from '../../../shared/contracts/app-config';

function isLoopback(address: string | undefined): boolean {
  if (!address) return false;
  const plain = address.startsWith('::ffff:') && isIP(address.slice(7)) === 4 ? address.slice(7) : address;
  return plain === '::1' || (isIP(plain) === 4 && plain.startsWith('127.'));
}

/**
 * The mailbox holds live invitation links: it answers only requests made on this machine (the connection and, behind
 * a trusted proxy, the client address are loopback); from anywhere else it does not exist (404).
 */
export const loopbackOnly: RequestHandler = (req, _res, next) => {
  if (!isLoopback(req.socket.remoteAddress) || !isLoopback(req.ip)) throw new HttpError(404, 'not_found', `No API route ${req.method} ${req.baseUrl}`);
  next();
};

/** Only admins of the invented demo organisation may read or empty the mailbox (403 for everyone else). Use after requireUser. */
export const requireDemoAdmin: RequestHandler = (req, _res, next) => {
  const user = currentUser(req);
  if (user.role !== 'admin' || user.organisationName !== demoOrganisationName) {
    throw new HttpError(403, 'forbidden', 'The development mailbox is for the demo organisation’s admin (admin@demo.stillspan.test)');
  }
  next();
};

/**
 * GET /api/dev/mail (never mounted in production; loopback only; demo admins only, see app.ts): the mails the local
 * fake SMTP server caught, newest first, so that invitation links can be followed without a real mailbox. DELETE
 * empties the list.
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
