import express, { type Router } from 'express';
import { isValidAccess, requireAccess } from './access';
import { multipartBody } from './multipart';
import { routeInput } from './request-input';
import type { RouteContext, RouteDefinition } from './route-definition';
import { withinRecordedRequest } from './validation-recorder';

/**
 * Builds the Express router from the route table; refuses a route without a valid access.
 * Each request is validated against the schemas its line declares before the handler runs.
 */
export function buildRouter(routes: readonly RouteDefinition[], appCtx: Omit<RouteContext, 'routes'>): Router {
  const router = express.Router();
  const ctx: RouteContext = { ...appCtx, routes };
  for (const route of routes) {
    if (!isValidAccess(route.access)) {
      throw new Error(`Route ${route.method.toUpperCase()} ${route.path} has no valid access declared.`);
    }
    const handle = (req: express.Request, res: express.Response) =>
      withinRecordedRequest(route.method, route.path, async () => {
        const input = routeInput(route, req);
        await route.handler(req, res, ctx, input as never);
      });
    if (route.multipart) router[route.method](route.path, requireAccess(route), multipartBody, handle);
    else router[route.method](route.path, requireAccess(route), handle);
  }
  return router;
}
