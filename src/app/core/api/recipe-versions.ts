import { computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { isApiError } from '../http/api-error';
import { callerHandles } from '../http/caller-handles';
import { RecipeApi } from './recipe-api';

/** How a page that shows a recipe's versions stands: a recipe that does not exist is `missing`, not an error. */
export type VersionsState = 'loading' | 'missing' | 'failed' | 'ready';

/**
 * Every version of a recipe, newest first, as a resource. A recipe that does not exist gets
 * its own message on the page rather than a snack bar, so 404 is left to the caller; other
 * failures have been shown by the error interceptor. A reload keeps the versions on screen.
 * Call in an injection context.
 */
export function recipeVersions(recipeId: () => number) {
  const api = inject(RecipeApi);
  const resource = rxResource({ params: () => recipeId(), stream: ({ params }) => api.versions(params, callerHandles(404)) });
  const list = computed<RecipeVersionDto[]>(() => (resource.hasValue() ? resource.value() : []));
  const state = computed<VersionsState>(() => {
    if (resource.status() === 'loading') return 'loading';
    const error = resource.error();
    if (error) return isApiError(error) && error.status === 404 ? 'missing' : 'failed';
    return list().length ? 'ready' : 'missing';
  });
  return { resource, list, state };
}
