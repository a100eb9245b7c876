import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { currentUser, requireUser } from '../auth/access';
import { acceptInvite, previewInvite } from '../services/invite.service';

/**
 * The invitation link's API: anyone holding the token may look; accepting
 * needs a signed-in user whose e-mail is the invited one (a forwarded or
 * leaked link does not let someone else in).
 */
export function inviteRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/invites/:token', async (req, res) => {
    res.set('Cache-Control', 'no-store').json(await previewInvite(String(req.params.token)));
  });
  router.post('/invites/:token/accept', requireUser, async (req, res) => {
    const user = currentUser(req);
    res.json(await acceptInvite(sequelize, String(req.params.token), { id: user.id, email: user.email }));
  });
  return router;
}
