import { Router } from 'express';
import { allow } from '../policy';
import { memberOf } from '../viewer';

/** GET /api/me — any signed-in member: who am I, in which workspace, with which role. */
export function meRoutes(): Router {
  const router = Router();
  router.get('/', allow('workspace.read'), (req, res) => {
    const { user, workspace, role } = memberOf(req);
    res.json({
      user: { id: user.id, email: user.email, displayName: user.displayName },
      workspace: { id: workspace.id, slug: workspace.slug, name: workspace.name },
      role,
    });
  });
  return router;
}
