import type { finderQuery } from '../../../shared/schemas/operator';
import { findRecipes } from '../../services/operator/finder';
import type { RouteHandler } from '../route-definition';

export const find: RouteHandler<{ query: typeof finderQuery }> = async (_req, res, { db }, { query }) => {
  res.json(await findRecipes(db, query));
};
