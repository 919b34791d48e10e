import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { RecipeComparison, RecipeVersionDto, ReviewCommentDto, TodayDto } from '@shared/recipe-types';
import type { ApproveBody, CommentBody, NewVersionBody, ReturnBody, SubmitBody, WithdrawBody } from '@shared/schemas/workflow';

/** Thin typed wrapper around the review routes (DEVELOPERS.md, Review routes). Every transition answers the updated version. */
@Injectable({ providedIn: 'root' })
export class WorkflowApi {
  private readonly http = inject(HttpClient);

  submit(recipeId: number, version: number, body: SubmitBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>(this.versionUrl(recipeId, version, 'submit'), body, { context });
  }

  /** Sends an in-review version back to its author with a comment. */
  returnToAuthor(recipeId: number, version: number, body: ReturnBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>(this.versionUrl(recipeId, version, 'return'), body, { context });
  }

  approve(recipeId: number, version: number, body: ApproveBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>(this.versionUrl(recipeId, version, 'approve'), body, { context });
  }

  withdraw(recipeId: number, version: number, body: WithdrawBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>(this.versionUrl(recipeId, version, 'withdraw'), body, { context });
  }

  /** A new draft copied from `body.fromVersion`. */
  newVersion(recipeId: number, body: NewVersionBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>(`/api/recipes/${recipeId}/versions`, body, { context });
  }

  comments(recipeId: number, version: number): Observable<ReviewCommentDto[]> {
    return this.http.get<ReviewCommentDto[]>(this.versionUrl(recipeId, version, 'comments'));
  }

  addComment(recipeId: number, version: number, body: CommentBody, context?: HttpContext): Observable<ReviewCommentDto> {
    return this.http.post<ReviewCommentDto>(this.versionUrl(recipeId, version, 'comments'), body, { context });
  }

  compare(recipeId: number, from: number, to: number): Observable<RecipeComparison> {
    return this.http.get<RecipeComparison>(`/api/recipes/${recipeId}/compare`, { params: { from, to } });
  }

  today(): Observable<TodayDto> {
    return this.http.get<TodayDto>('/api/today');
  }

  private versionUrl(recipeId: number, version: number, action: string): string {
    return `/api/recipes/${recipeId}/versions/${version}/${action}`;
  }
}
