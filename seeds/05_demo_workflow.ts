import type { Knex } from 'knex';
import type { RecipeVersionDto } from '../shared/recipe-types';
import type { Actor } from '../server/services/actor';
import { utcDay } from '../shared/calendar-dates';
import { saveDraft, versionDto } from '../server/services/recipes/recipes';
import { approveVersion, createNextVersion, returnVersion, submitVersion, withdrawVersion } from '../server/services/recipes/workflow';
import { DEMO_ACCOUNTS } from './data/demo-accounts';
import { demoAuthor } from './data/demo-author';
import { DEMO_HISTORY, type DemoStep } from './data/demo-workflow';

const DAY_MS = 24 * 60 * 60 * 1000;

async function demoApprover(knex: Knex): Promise<{ actor: Actor; username: string; password: string }> {
  const account = DEMO_ACCOUNTS.find((a) => a.roles.includes('approver'));
  const row = account
    ? ((await knex('users').where({ username: account.username }).first('id', 'display_name')) as { id: number; display_name: string } | undefined)
    : undefined;
  if (!account || !row) throw new Error('The demo approver is missing: the people seed must run first.');
  return { actor: { userId: row.id, name: row.display_name, clientAddress: '' }, username: account.username, password: account.password };
}

/**
 * The demo recipes' review history (seeds/data/demo-workflow.ts), played through the same
 * workflow services as the API, each step with its own day as `now`. A recipe whose first
 * version is no longer an untouched draft is skipped, so a second run changes nothing.
 */
export async function seed(knex: Knex): Promise<void> {
  const author = await demoAuthor(knex);
  const approver = await demoApprover(knex);
  const loadedAt = Date.now();
  const dayOf = (daysAgo: number) => new Date(loadedAt - daysAgo * DAY_MS);

  for (const history of DEMO_HISTORY) {
    const recipe = (await knex('recipes').where({ title: history.title }).first('id')) as { id: number } | undefined;
    if (!recipe) throw new Error(`The demo history names "${history.title}", which is not a demo recipe.`);
    const versions = (await knex('recipe_versions').where({ recipe_id: recipe.id }).select('id', 'status')) as { id: number; status: string }[];
    if (versions.length !== 1 || versions[0]!.status !== 'draft') continue;

    // The draft was written just now by the recipe seed; date it a day before its history
    // starts (a seed-only update while it is still a draft), so its own dates read in order.
    const first = history.steps[0]!;
    const writtenAt = dayOf(first.daysAgo + 1);
    await knex('recipe_versions').where({ id: versions[0]!.id }).update({ created_at: writtenAt, updated_at: writtenAt });
    await knex('recipes').where({ id: recipe.id }).update({ created_at: writtenAt, updated_at: writtenAt });
    await knex('recipe_version_editors').where({ version_id: versions[0]!.id }).update({ first_edited_at: writtenAt, last_edited_at: writtenAt });

    let v: RecipeVersionDto = await versionDto(knex, recipe.id, 1);
    for (const step of history.steps) v = await play(knex, step, v, dayOf(step.daysAgo), author, approver);
  }
}

async function play(
  knex: Knex,
  step: DemoStep,
  v: RecipeVersionDto,
  at: Date,
  author: Actor,
  approver: { actor: Actor; username: string; password: string },
): Promise<RecipeVersionDto> {
  const { recipeId, version, revision } = v;
  switch (step.kind) {
    case 'submit':
      return submitVersion(knex, author, recipeId, version, { revision }, at);
    case 'return':
      return returnVersion(knex, approver.actor, recipeId, version, { revision, comment: step.comment }, at);
    case 'approve':
      return approveVersion(
        knex,
        approver.actor,
        recipeId,
        version,
        {
          revision,
          username: approver.username,
          password: approver.password,
          meaning: 'approved',
          comment: step.comment ?? '',
          // The demo approver has read every warning of these recipes.
          acknowledgedWarnings: v.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
          ...(step.effectiveInDays ? { effectiveDate: utcDay(new Date(at.getTime() + step.effectiveInDays * DAY_MS)) } : {}),
        },
        at,
      );
    case 'withdraw':
      return withdrawVersion(
        knex,
        approver.actor,
        recipeId,
        version,
        { revision, username: approver.username, password: approver.password, meaning: 'withdrawn', reason: step.reason },
        at,
      );
    case 'new-version': {
      const draft = await createNextVersion(knex, author, recipeId, { fromVersion: version, changeReason: step.changeReason }, at);
      return saveDraft(knex, author, recipeId, draft.version, { revision: draft.revision, title: draft.title, content: step.change(draft.content) }, at);
    }
  }
}
