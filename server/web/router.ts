import express, { type Router } from 'express';
import { isValidAccess, requireAccess } from './access';
import type { RouteContext, RouteDefinition } from './route-definition';

/** Builds the Express router from the route table; refuses a route without a valid access. */
export function buildRouter(routes: readonly RouteDefinition[], ctx: RouteContext): Router {
  const router = express.Router();
  for (const route of routes) {
    if (!isValidAccess(route.access)) {
      throw new Error(`Route ${route.method.toUpperCase()} ${route.path} has no valid access declared.`);
    }
    router[route.method](route.path, requireAccess(route), async (req, res) => {
      await route.handler(req, res, ctx);
    });
  }
  return router;
}
