import type { idParams } from '../../../shared/schemas/params';
import type { compareQuery } from '../../../shared/schemas/workflow';
import * as compare from '../../services/recipes/compare';
import { reportIntegrityFailure } from '../../services/recipes/integrity-alert';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';

export const versions: RouteHandler<{ params: typeof idParams; query: typeof compareQuery }> = async (
  req,
  res,
  { db, mail },
  { params, query: { from, to } },
) => {
  // Units as the person chose to see them: the labels carry the values.
  const comparison = await compare.compareRecipeVersions(db, params.id, from, to, req.user?.units ?? 'metric', versionScopeOf(req.user?.roles));
  for (const side of [comparison.from, comparison.to]) {
    if (side.integrity && !side.integrity.ok)
      await reportIntegrityFailure(db, mail, { recipeId: params.id, number: comparison.number, ...side }, side.integrity);
  }
  res.json(comparison);
};
