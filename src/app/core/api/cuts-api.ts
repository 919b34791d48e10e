import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CutRecordDto, CutTrace } from '@shared/recipe-types';
import type { CutRecordBody } from '@shared/schemas/operator';

/** Thin typed wrapper around the cut-record routes (DEVELOPERS.md, Operator routes). */
@Injectable({ providedIn: 'root' })
export class CutsApi {
  private readonly http = inject(HttpClient);

  /** Logs one cut against the exact version used; only the current version takes cuts. */
  log(recipeId: number, version: number, body: CutRecordBody, context?: HttpContext): Observable<CutRecordDto> {
    return this.http.post<CutRecordDto>(`/api/recipes/${recipeId}/versions/${version}/cuts`, body, { context });
  }

  /** Every cut made with a version, newest first. */
  forVersion(recipeId: number, version: number): Observable<CutRecordDto[]> {
    return this.http.get<CutRecordDto[]>(`/api/recipes/${recipeId}/versions/${version}/cuts`);
  }

  /** From a specimen id to the cut(s) and the version used. */
  trace(specimenId: string): Observable<CutTrace[]> {
    return this.http.get<CutTrace[]>('/api/cuts', { params: { specimenId } });
  }

  /** The author has looked at a flagged cut. */
  clearFlag(cutId: number): Observable<CutRecordDto> {
    return this.http.post<CutRecordDto>(`/api/cuts/${cutId}/clear-flag`, {});
  }
}

/** The CSV export of a version's cuts (a plain link: the browser downloads it with the session cookie). */
export function cutsCsvUrl(recipeId: number, version: number): string {
  return `/api/recipes/${recipeId}/versions/${version}/cuts.csv`;
}
