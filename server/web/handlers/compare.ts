import { compareQuery } from '../../../shared/schemas/workflow';
import * as compare from '../../services/recipes/compare';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { idOf, parse } from './parse';

export const versions: RouteHandler = async (req, res, { db }) => {
  const recipeId = idOf(req.params);
  const { from, to } = parse(compareQuery, req.query);
  // Units as the person chose to see them (metric, or metric + imperial): the labels carry the values.
  res.json(await compare.compareRecipeVersions(db, recipeId, from, to, req.user?.units ?? 'metric', versionScopeOf(req.user?.roles)));
};
