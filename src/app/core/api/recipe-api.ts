import { HttpClient, type HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { RecipeSummary, RecipeVersionDto } from '@shared/recipe-types';
import type { RecipeListQuery } from '@shared/schemas/recipe';

/** Thin typed wrapper around the read side of `/api/recipes` (DEVELOPERS.md, Authoring routes). */
@Injectable({ providedIn: 'root' })
export class RecipeApi {
  private readonly http = inject(HttpClient);

  /** Empty filters are left out of the query string, so the server applies its defaults. */
  list(query: Partial<RecipeListQuery>): Observable<Page<RecipeSummary>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<Page<RecipeSummary>>('/api/recipes', { params });
  }

  /** Every version of a recipe, newest first. */
  versions(recipeId: number, context?: HttpContext): Observable<RecipeVersionDto[]> {
    return this.http.get<RecipeVersionDto[]>(`/api/recipes/${recipeId}/versions`, { context });
  }

  version(recipeId: number, version: number, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.get<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/${version}`, { context });
  }
}
