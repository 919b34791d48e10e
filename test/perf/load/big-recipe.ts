/**
 * The recipe behind the "30 kB" figures: two versions whose text fields are full —
 * instructions 20,000 characters, acceptance criteria 5,000 and cautions 5,000 (the schema's
 * limits, shared/schemas/recipe.ts), about 30 kB of Markdown per version. Version 1 is
 * approved, version 2 a draft that rewords every fifth step, so the comparison has real
 * differences to find. Made once through the app's own services (checks, workflow, trail)
 * and found again by its title on later runs.
 */
import type { Knex } from 'knex';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import type { Actor } from '../../../server/services/actor';
import { createRecipe, saveDraft } from '../../../server/services/recipes/recipes';
import { approveVersion, createNextVersion, submitVersion } from '../../../server/services/recipes/workflow';
import type { BenchRole, BenchUser } from './users';

export const BIG_RECIPE_TITLE = 'Bench — full-length instructions (30 kB)';

export interface BigRecipe {
  recipeId: number;
  /** UTF-8 bytes of instructions + acceptance + cautions, per version. */
  textBytes: [number, number];
}

/** Markdown of exactly `length` characters built from numbered steps; `variant` rewords every fifth. */
function filler(kind: string, length: number, variant: number): string {
  const lines: string[] = [];
  let size = 0;
  for (let i = 1; size < length; i++) {
    const reworded = variant > 0 && i % 5 === 0;
    const line = reworded
      ? `${i}. ${kind}: after ${i * 2} mm of cut, stop the feed, let the wheel clear the kerf and check the coolant reaches it (revised in version ${variant + 1}).`
      : `${i}. ${kind}: keep the feed steady at the set rate through section ${i}; watch for discolouration at the kerf and clamp both sides firmly.`;
    lines.push(line);
    size += line.length + 1;
  }
  return lines.join('\n').slice(0, length);
}

function bigContent(template: RecipeContent, variant: number): RecipeContent {
  return {
    ...template,
    instructionsMd: filler('Step', 20000, variant),
    acceptanceMd: filler('Accept', 5000, variant),
    cautionsMd: filler('Caution', 5000, variant),
    changeReason: variant > 0 ? 'Bench: every fifth step reworded.' : '',
  };
}

function textBytes(c: RecipeContent): number {
  return Buffer.byteLength(c.instructionsMd + c.acceptanceMd + c.cautionsMd, 'utf8');
}

const actor = (u: BenchUser): Actor => ({ userId: u.id, name: u.username, clientAddress: '127.0.0.1' });

export async function ensureBigRecipe(db: Knex, users: Record<BenchRole, BenchUser>): Promise<BigRecipe> {
  const found = (await db('recipes').where({ title: BIG_RECIPE_TITLE }).first('id')) as { id: number } | undefined;
  if (found) {
    const rows = (await db('recipe_versions').where({ recipe_id: found.id }).orderBy('version').select('content_json')) as { content_json: string }[];
    if (rows.length >= 2) {
      const sizes = rows.slice(0, 2).map((r) => textBytes(JSON.parse(r.content_json) as RecipeContent));
      return { recipeId: found.id, textBytes: [sizes[0]!, sizes[1]!] };
    }
  }

  // Any approved version the checks still pass (its stock not archived since) serves as the model.
  const candidates = (await db('recipe_versions')
    .where({ status: 'approved' })
    .whereNot('worst_check', 'blocker')
    .orderBy('id')
    .limit(20)
    .select('content_json')) as {
    content_json: string;
  }[];
  let lastError: unknown = new Error('The database has no approved recipe version to model the bench recipe on.');
  for (const c of candidates) {
    const template = JSON.parse(c.content_json) as RecipeContent;
    const v1 = bigContent(template, 0);
    try {
      const created = await createRecipe(db, actor(users.author), { title: BIG_RECIPE_TITLE, content: v1 });
      const submitted = await submitVersion(db, actor(users.author), created.recipeId, 1, { revision: created.revision });
      await approveVersion(db, actor(users.approver), created.recipeId, 1, {
        revision: submitted.revision,
        username: users.approver.username,
        password: users.approver.password,
        meaning: 'approved',
        comment: '',
        acknowledgedWarnings: submitted.checks.filter((k) => k.severity === 'warning').map((k) => k.id),
      });
      const next = await createNextVersion(db, actor(users.author), created.recipeId, { fromVersion: 1, changeReason: 'Bench: every fifth step reworded.' });
      const v2 = bigContent(template, 1);
      await saveDraft(db, actor(users.author), created.recipeId, 2, { revision: next.revision, title: BIG_RECIPE_TITLE, content: v2 });
      return { recipeId: created.recipeId, textBytes: [textBytes(v1), textBytes(v2)] };
    } catch (err) {
      lastError = err;
      // A half-made recipe (e.g. submit refused) is renamed so the next candidate starts clean.
      await db('recipes')
        .where({ title: BIG_RECIPE_TITLE })
        .update({ title: `${BIG_RECIPE_TITLE} (discarded)` });
    }
  }
  throw new Error(`Could not create the 30 kB bench recipe: ${lastError instanceof Error ? lastError.message : String(lastError)}`);
}
