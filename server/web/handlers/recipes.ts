import type { idParams, versionParams } from '../../../shared/schemas/params';
import type { createRecipeBody, recipeListQuery, saveDraftBody } from '../../../shared/schemas/recipe';
import { versionScopeOf } from '../../services/operator/visibility';
import { reportIntegrityFailure } from '../../services/recipes/integrity-alert';
import * as recipes from '../../services/recipes/recipes';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

export const list: RouteHandler<{ query: typeof recipeListQuery }> = async (req, res, { db }, { query }) => {
  res.json(await recipes.listRecipes(db, query, versionScopeOf(req.user?.roles)));
};

export const create: RouteHandler<{ body: typeof createRecipeBody }> = async (req, res, { db }, { body }) => {
  res.status(201).json(await recipes.createRecipe(db, actorOf(req), body));
};

export const versions: RouteHandler<{ params: typeof idParams }> = async (req, res, { db }, { params }) => {
  res.json(await recipes.listVersions(db, params.id, versionScopeOf(req.user?.roles)));
};

export const getVersion: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db, mail }, { params: { id, n } }) => {
  const viewer = req.user ? { id: req.user.id, roles: req.user.roles } : undefined;
  const dto = await recipes.getVersion(db, id, n, versionScopeOf(req.user?.roles), viewer);
  if (dto.integrity && !dto.integrity.ok) await reportIntegrityFailure(db, mail, dto, dto.integrity);
  res.json(dto);
};

export const saveDraft: RouteHandler<{ params: typeof versionParams; body: typeof saveDraftBody }> = async (req, res, { db }, { params: { id, n }, body }) => {
  res.json(await recipes.saveDraft(db, actorOf(req), id, n, body));
};
