/**
 * Review comments on a version (the Review screen): kept for good (the database
 * refuses changing or deleting them), each with its author's printed name at the time.
 */
import type { Knex } from 'knex';
import type { ReviewCommentDto } from '../../../shared/recipe-types';
import type { CommentBody } from '../../../shared/schemas/workflow';
import { AppError } from '../../app-error';
import { findRecipeRow, findVersion } from '../../data/recipes';
import { findReviewCommentRow, insertReviewComment, listReviewCommentRows, type ReviewCommentRow } from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { visibleVersion, type VersionScope } from '../operator/visibility';
import { requireActor } from './recipes';

export function toReviewCommentDto(row: ReviewCommentRow): ReviewCommentDto {
  return {
    id: row.id,
    authorName: row.author_name,
    authorId: row.author_id,
    body: row.body,
    path: row.path,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

async function versionIdOf(db: Knex, recipeId: number, version: number): Promise<number> {
  const row = await findVersion(db, recipeId, version);
  if (row) return row.id;
  const recipe = await findRecipeRow(db, recipeId);
  throw AppError.notFound(recipe ? `Recipe ${recipe.number} has no version ${version}.` : `There is no recipe with id ${recipeId}.`);
}

/** Oldest first, as a conversation reads. */
export async function listComments(db: Knex, recipeId: number, version: number, scope: VersionScope = 'all'): Promise<ReviewCommentDto[]> {
  const versionId = (await visibleVersion(db, scope, recipeId, version)).id;
  return (await listReviewCommentRows(db, versionId)).map(toReviewCommentDto);
}

export async function addComment(db: Knex, actor: Actor, recipeId: number, version: number, body: CommentBody, now = new Date()): Promise<ReviewCommentDto> {
  const userId = requireActor(actor);
  const versionId = await versionIdOf(db, recipeId, version);
  const id = await db.transaction(async (trx) => {
    const commentId = await insertReviewComment(trx, {
      version_id: versionId,
      author_id: userId,
      author_name: actor.name.slice(0, 100),
      body: body.body,
      path: body.path,
      created_at: now,
    });
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.reviewCommentAdded,
        entityType: 'recipe_version',
        entityId: versionId,
        before: null,
        after: { commentId, versionId, path: body.path, body: body.body },
      },
      now,
    );
    return commentId;
  });
  return toReviewCommentDto((await findReviewCommentRow(db, id))!);
}
