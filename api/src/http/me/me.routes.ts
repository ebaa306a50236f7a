import { Router } from 'express';

/** GET /api/me — any signed-in member: who am I, in which workspace, with which role. */
export function meRoutes(): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const { user, workspace, role } = req.viewer!;
    res.json({
      user: { id: user.id, email: user.email, displayName: user.displayName },
      workspace: { id: workspace.id, slug: workspace.slug, name: workspace.name },
      role,
    });
  });
  return router;
}
