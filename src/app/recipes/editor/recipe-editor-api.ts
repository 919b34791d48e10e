import { HttpClient, type HttpContext, type HttpEvent, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, map } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { AttachmentDto, RecipeVersionDto } from '@shared/recipe-types';
import type { CreateRecipeBody, SaveDraftBody } from '@shared/schemas/recipe';
import type { LabLimits, MachineRecord, MaterialRecord, SelectionRow, WheelRecord } from '@shared/stock-types';

/** Roles an attachment can play on the recipe page and the bench sheet. */
export type AttachmentRole = AttachmentDto['role'];

/** Largest stock page the server hands out; a lab's stock fits in one page. */
const STOCK_PAGE = 200;

/** Thin typed wrapper around the authoring routes the editor needs (DEVELOPERS.md, Authoring routes). */
@Injectable({ providedIn: 'root' })
export class RecipeEditorApi {
  private readonly http = inject(HttpClient);

  /** Stock that may be chosen for a new recipe: not archived. */
  materials(): Observable<MaterialRecord[]> {
    return this.stock<MaterialRecord>('/api/materials');
  }

  machines(): Observable<MachineRecord[]> {
    return this.stock<MachineRecord>('/api/machines');
  }

  wheels(): Observable<WheelRecord[]> {
    return this.stock<WheelRecord>('/api/wheels');
  }

  /** One record by id, archived or not (a draft may still reference an archived one). */
  material(id: number): Observable<MaterialRecord> {
    return this.http.get<MaterialRecord>(`/api/materials/${id}`);
  }

  machine(id: number): Observable<MachineRecord> {
    return this.http.get<MachineRecord>(`/api/machines/${id}`);
  }

  wheel(id: number): Observable<WheelRecord> {
    return this.http.get<WheelRecord>(`/api/wheels/${id}`);
  }

  selectionRows(): Observable<SelectionRow[]> {
    return this.http.get<SelectionRow[]>('/api/selection-rows');
  }

  limits(): Observable<LabLimits> {
    return this.http.get<LabLimits>('/api/settings/limits');
  }

  /** All versions, newest first. */
  versions(recipeId: number): Observable<RecipeVersionDto[]> {
    return this.http.get<RecipeVersionDto[]>(`/api/recipes/${recipeId}/versions`);
  }

  version(recipeId: number, version: number): Observable<RecipeVersionDto> {
    return this.http.get<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/${version}`);
  }

  create(body: CreateRecipeBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.post<RecipeVersionDto>('/api/recipes', body, { context });
  }

  /** Saves a draft; `body.revision` is the revision the edit started from (stale → 409). */
  save(recipeId: number, version: number, body: SaveDraftBody, context?: HttpContext): Observable<RecipeVersionDto> {
    return this.http.put<RecipeVersionDto>(`/api/recipes/${recipeId}/versions/${version}`, body, { context });
  }

  /** Uploads a photo as multipart form data, reporting upload progress as HttpEvents. */
  uploadAttachment(
    recipeId: number,
    version: number,
    file: File,
    role: AttachmentRole,
    caption: string,
    context?: HttpContext,
  ): Observable<HttpEvent<AttachmentDto>> {
    const form = new FormData();
    form.append('file', file, file.name);
    form.append('role', role);
    form.append('caption', caption);
    return this.http.post<AttachmentDto>(`/api/recipes/${recipeId}/versions/${version}/attachments`, form, {
      context,
      reportProgress: true,
      observe: 'events',
    });
  }

  deleteAttachment(recipeId: number, version: number, attachmentId: number): Observable<void> {
    return this.http.delete<void>(`/api/recipes/${recipeId}/versions/${version}/attachments/${attachmentId}`);
  }

  private stock<T>(url: string): Observable<T[]> {
    const params = new HttpParams().set('pageSize', STOCK_PAGE).set('archived', 'no').set('sort', 'name');
    return this.http.get<Page<T>>(url, { params }).pipe(map((page) => page.items));
  }
}
