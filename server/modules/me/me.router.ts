import { Router } from 'express';
import { currentUser } from '../../middleware/auth';
import type { Me } from '../../../shared/contracts/me';

/** GET /api/me: the signed-in person, with their current role and organisation. */
export function meRouter(): Router {
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
  return router;
}
