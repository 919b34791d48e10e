import { HttpClient, type HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { RecipeComparison } from '../../../../shared/recipe-types';
import type { CompareQuery } from '../../../../shared/schemas/workflow';

/** Thin typed wrapper around `GET /api/recipes/:id/compare` (DEVELOPERS.md, Review routes). */
@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  compare(recipeId: number, query: CompareQuery, context?: HttpContext): Observable<RecipeComparison> {
    const params = new HttpParams().set('from', query.from).set('to', query.to);
    return this.http.get<RecipeComparison>(`/api/recipes/${recipeId}/compare`, { params, context });
  }
}
