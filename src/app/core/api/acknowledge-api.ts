import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AcknowledgementsDto, ChangesSinceAcknowledgedDto, MyAcknowledgementDto } from '@shared/recipe-types';

/** Thin typed wrapper around the acknowledgement routes (DEVELOPERS.md, Mail, link and acknowledgement routes). */
@Injectable({ providedIn: 'root' })
export class AcknowledgeApi {
  private readonly http = inject(HttpClient);

  /** The signed-in operator reads and understands a version; idempotent, 409 when it is not theirs to acknowledge. */
  acknowledge(recipeId: number, version: number, context?: HttpContext): Observable<MyAcknowledgementDto> {
    return this.http.post<MyAcknowledgementDto>(`/api/recipes/${recipeId}/versions/${version}/acknowledge`, {}, { context });
  }

  /** Who has acknowledged a version and which assigned operators have not yet. */
  acknowledgements(recipeId: number, version: number, context?: HttpContext): Observable<AcknowledgementsDto> {
    return this.http.get<AcknowledgementsDto>(`/api/recipes/${recipeId}/versions/${version}/acknowledgements`, { context });
  }

  /** What changed since the version of the recipe the signed-in operator last acknowledged. */
  changesSince(recipeId: number, version: number, context?: HttpContext): Observable<ChangesSinceAcknowledgedDto> {
    return this.http.get<ChangesSinceAcknowledgedDto>(`/api/recipes/${recipeId}/versions/${version}/changes-since-acknowledged`, { context });
  }
}
