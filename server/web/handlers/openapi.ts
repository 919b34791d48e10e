import { openApiDocument } from '../openapi/openapi-document';
import type { RouteHandler } from '../route-definition';

/** GET /api/openapi.json — the API reference of the routes this server serves. */
export const document: RouteHandler = (_req, res, { routes }) => {
  res.json(openApiDocument(routes));
};
