import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { FinderHit } from '@shared/recipe-types';
import type { FinderQuery } from '@shared/schemas/operator';
import { finderParams } from './finder-params';

/** GET /api/finder: the current approved versions that cover a part, best first. */
@Injectable({ providedIn: 'root' })
export class FinderApi {
  private readonly http = inject(HttpClient);

  find(query: FinderQuery, context?: HttpContext): Observable<FinderHit[]> {
    return this.http.get<FinderHit[]>('/api/finder', { params: finderParams(query), context });
  }
}
