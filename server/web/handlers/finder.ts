import { finderQuery } from '../../../shared/schemas/operator';
import { findRecipes } from '../../services/operator/finder';
import type { RouteHandler } from '../route-definition';
import { parse } from './parse';

export const find: RouteHandler = async (req, res, { db }) => {
  res.json(await findRecipes(db, parse(finderQuery, req.query)));
};
