import { Router } from 'express';
import { IdParam } from '../../shared/schemas/user';
import type { Role, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { visibleAnnotation, visibleCapture, visibleComparison, visibleProject, visibleShare } from '../services/visibility';
import { currentUser } from './auth';

type Resolve = (ctx: AppContext, user: User, id: number) => Promise<Role>;

/** Every family of routes reached by the id of something that lives in a project. */
const SCOPES: [string, Resolve][] = [
  ['/projects/:id', visibleProject],
  ['/captures/:id', visibleCapture],
  ['/comparisons/:id', visibleComparison],
  ['/annotations/:id', visibleAnnotation],
  ['/shares/:id', visibleShare],
];

/**
 * Mounted after requireSession and before every route: resolves the id in the path to the asking
 * user's role in its project, answering 404 when it is hidden from them (members-only) or does not
 * exist, so nothing under these paths (samples, analysis, originals, annotations, shares, and routes
 * added later) can leak it. allow() then checks that role. The id is parsed as the routes parse it,
 * so both always mean the same thing; an id that does not parse is left to the route's 400.
 */
export function projectScopes(ctx: AppContext): Router {
  const router = Router();
  for (const [path, resolve] of SCOPES) {
    router.use(path, async (req, _res, next) => {
      const parsed = IdParam.safeParse(req.params);
      if (!parsed.success) return next();
      req.projectRole = await resolve(ctx, currentUser(req), parsed.data.id);
      next();
    });
  }
  return router;
}
