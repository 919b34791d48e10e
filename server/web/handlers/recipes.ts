import { z } from 'zod';
import { idParam } from '../../../shared/schemas/fields';
import { createRecipeBody, recipeListQuery, saveDraftBody } from '../../../shared/schemas/recipe';
import { versionScopeOf } from '../../services/operator/visibility';
import * as recipes from '../../services/recipes/recipes';
import type { RouteHandler } from '../route-definition';
import { bodyOf, idOf, parse } from './parse';
import { actorOf } from './request-actor';

const versionParams = z.object({ id: idParam, n: idParam });

export const list: RouteHandler = async (req, res, { db }) => {
  res.json(await recipes.listRecipes(db, parse(recipeListQuery, req.query), versionScopeOf(req.user?.roles)));
};

export const create: RouteHandler = async (req, res, { db }) => {
  const body = parse(createRecipeBody, bodyOf(req.body));
  res.status(201).json(await recipes.createRecipe(db, actorOf(req), body));
};

export const versions: RouteHandler = async (req, res, { db }) => {
  res.json(await recipes.listVersions(db, idOf(req.params), versionScopeOf(req.user?.roles)));
};

export const getVersion: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  const viewer = req.user ? { id: req.user.id, roles: req.user.roles } : undefined;
  res.json(await recipes.getVersion(db, id, n, versionScopeOf(req.user?.roles), viewer));
};

export const saveDraft: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  const body = parse(saveDraftBody, bodyOf(req.body));
  res.json(await recipes.saveDraft(db, actorOf(req), id, n, body));
};
