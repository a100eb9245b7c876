import { Router } from 'express';
import { HttpError } from '../middleware/http-error';
import { requireUser } from '../auth/access';

/**
 * Dev/demo only: the mails the local fake mail server caught, so an
 * invitation link can be followed without a real inbox. Mounted only while
 * mail goes to that fake (never with a real SMTP relay). The mails hold
 * working invitation links, so only a signed-in person may read them.
 */
export function devRoutes(mailboxUrl: string): Router {
  const router = Router();
  router.get('/dev/mailbox', requireUser, async (_req, res) => {
    let response: Response;
    try {
      response = await fetch(`${mailboxUrl}/messages`, { signal: AbortSignal.timeout(3_000) });
    } catch {
      throw new HttpError(502, `The local fake mail server does not answer at ${mailboxUrl}; start it with npm run dev or npm start.`);
    }
    res.set('Cache-Control', 'no-store').json(await response.json());
  });
  return router;
}
