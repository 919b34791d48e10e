import express, { type Router } from 'express';
import { isValidAccess, requireAccess } from './access';
import { multipartBody } from './multipart';
import type { RouteContext, RouteDefinition } from './route-definition';

/** Builds the Express router from the route table; refuses a route without a valid access. */
export function buildRouter(routes: readonly RouteDefinition[], ctx: RouteContext): Router {
  const router = express.Router();
  for (const route of routes) {
    if (!isValidAccess(route.access)) {
      throw new Error(`Route ${route.method.toUpperCase()} ${route.path} has no valid access declared.`);
    }
    const handle = async (req: express.Request, res: express.Response) => {
      await route.handler(req, res, ctx);
    };
    if (route.multipart) router[route.method](route.path, requireAccess(route), multipartBody, handle);
    else router[route.method](route.path, requireAccess(route), handle);
  }
  return router;
}
