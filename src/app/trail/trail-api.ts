import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, map } from 'rxjs';
import type { PersonNameDto, TrailPage, ChainVerification } from '@shared/recipe-types';
import type { TrailQuery } from '@shared/schemas/workflow';

function toParams(query: Partial<TrailQuery>): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
  }
  return params;
}

/** Thin typed wrapper around `/api/trail` (DEVELOPERS.md, Review routes). */
@Injectable({ providedIn: 'root' })
export class TrailApi {
  private readonly http = inject(HttpClient);

  /** One page, newest first; empty filters are left out of the query string. */
  list(query: Partial<TrailQuery>): Observable<TrailPage> {
    return this.http.get<TrailPage>('/api/trail', { params: toParams(query) });
  }

  /** Everyone the trail can name, for the person filter. */
  people(): Observable<PersonNameDto[]> {
    return this.http.get<{ items: PersonNameDto[] }>('/api/trail/people').pipe(map((answer) => answer.items));
  }

  /** Recomputes the whole hash chain on the server. */
  verify(): Observable<ChainVerification> {
    return this.http.get<ChainVerification>('/api/trail/verify');
  }

  /** A plain link for the browser to download: the session cookie goes along, no script involved. */
  csvUrl(query: Partial<TrailQuery>): string {
    const params = toParams(query).toString();
    return '/api/trail.csv' + (params ? `?${params}` : '');
  }
}
