import { Router } from 'express';
import { currentUser } from '../../middleware/auth';
import { changePasswordSchema, type Me } from '../../../shared/contracts/me';
import type { ExpressAuthConfig } from '@auth/express';
import { sessionMaxAgeS } from '../../auth/config';
import { reissueSessionCookie } from '../../auth/session-token';
import type { Database } from '../../db/client';
import { parsed, validate } from '../../middleware/validate';
import { changePassword } from './me.service';
import { updatePreferencesSchema } from '../../../shared/contracts/preferences';
import { getPreferences, updatePreferences } from './preferences.service';

/** GET /api/me: the signed-in person, with their current role and organisation; PUT /api/me/password; GET/PATCH /api/me/preferences. */
export function meRouter(db: Database, authConfig: ExpressAuthConfig): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const user = currentUser(req);
    const body: Me = {
      id: user.id,
      email: user.email,
      name: user.name,
      role: user.role,
      organisation: { id: user.organisationId, name: user.organisationName },
    };
    res.json(body);
  });
  router.put('/password', validate({ body: changePasswordSchema }), async (req, res) => {
    const generation = await changePassword(db, currentUser(req), req.body);
    // Every other session has ended; the device that changed the password stays signed in.
    await reissueSessionCookie(req, res, String(authConfig.secret), generation, sessionMaxAgeS);
    res.status(204).end();
  });
  router.get('/preferences', async (req, res) => {
    res.json(await getPreferences(db, currentUser(req)));
  });
  router.patch('/preferences', validate({ body: updatePreferencesSchema }), async (req, res) => {
    res.json(await updatePreferences(db, currentUser(req), parsed(updatePreferencesSchema, req.body)));
  });
  return router;
}
