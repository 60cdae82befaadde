import { Router } from 'express';
import { currentUser } from '../auth/current-user';
import { requireSignedIn } from '../http/guards';

export function createMeRouter({
  generateCsrfToken,
}: {
  generateCsrfToken: (req: Express.Request) => string;
}): Router {
  const router = Router();

  router.get('/api/me', requireSignedIn, function me(req, res) {
    const user = currentUser(req);
    res.set('Cache-Control', 'no-store').json({
      user: { id: user.id, email: user.email, displayName: user.displayName },
      roles: user.memberships,
      csrfToken: generateCsrfToken(req),
    });
  });

  return router;
}
