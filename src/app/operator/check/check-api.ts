import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CheckCodeResult } from '@shared/recipe-types';

/** GET /api/check/:code — what a printed sheet's code says now. */
@Injectable({ providedIn: 'root' })
export class CheckApi {
  private readonly http = inject(HttpClient);

  check(code: string, context?: HttpContext): Observable<CheckCodeResult> {
    return this.http.get<CheckCodeResult>(`/api/check/${encodeURIComponent(code)}`, { context });
  }
}
