import type { Knex } from 'knex';
import { createRecipeBody } from '../shared/schemas/recipe';
import { createRecipe } from '../server/services/recipes/recipes';
import { demoAuthor } from './data/demo-author';
import { DEMO_RECIPES, type DemoRecipe } from './data/demo-recipes';

async function idOf(knex: Knex, table: string, name: string): Promise<number> {
  const row = (await knex(table).where({ name }).first('id')) as { id: number } | undefined;
  if (!row) throw new Error(`Demo recipe data names "${name}", which is not in ${table}.`);
  return row.id;
}

/** The full content of a demo recipe, with the stock ids looked up by name. */
export async function demoRecipeBody(knex: Knex, recipe: DemoRecipe) {
  return createRecipeBody.parse({
    title: recipe.title,
    content: {
      scope: { ...recipe.scope, materialId: recipe.material === null ? null : await idOf(knex, 'materials', recipe.material) },
      cutting: { ...recipe.cutting, machineId: await idOf(knex, 'machines', recipe.machine), wheelId: await idOf(knex, 'wheels', recipe.wheel) },
      clamping: recipe.clamping,
      coolant: recipe.coolant,
      instructionsMd: recipe.instructionsMd,
      acceptanceMd: recipe.acceptanceMd,
      cautionsMd: recipe.cautionsMd,
      changeReason: '',
    },
  });
}

/**
 * The invented lab's recipes, written by the demo author through the recipe service, so
 * each gets its number, its checks and its trail event. Drafts for now; skips any title
 * already there.
 */
export async function seed(knex: Knex): Promise<void> {
  const actor = await demoAuthor(knex);
  for (const recipe of DEMO_RECIPES) {
    if (await knex('recipes').where({ title: recipe.title }).first()) continue;
    await createRecipe(knex, actor, await demoRecipeBody(knex, recipe));
  }
}
