import { HttpClient, type HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { Access } from '@shared/roles';
import type { MachineBody, MaterialBody, SelectionRowBody, StockListQuery, WheelBody } from '@shared/schemas/stock';
import type { SpeedMismatch } from '@shared/spindle-speed';
import type { LabLimits, MachineRecord, MaterialRecord, SelectionRow, WheelRecord } from '@shared/stock-types';

/** Who may change stock records (DEVELOPERS.md, Authoring routes); everyone signed in reads them. */
export const STOCK_EDITORS: Access = ['author', 'admin'];

/** The answer of DELETE: a record a recipe uses is archived instead of deleted. */
export interface DeleteOutcome {
  archived: boolean;
}

/** The six routes every stock kind shares (`/api/materials`, `/api/wheels`, `/api/machines`). */
export class StockResource<TBody, TRecord> {
  constructor(
    private readonly http: HttpClient,
    private readonly base: string,
  ) {}

  /** Empty filters are left out of the query string, so the server applies its defaults. */
  list(query: Partial<StockListQuery>): Observable<Page<TRecord>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<Page<TRecord>>(this.base, { params });
  }

  get(id: number): Observable<TRecord> {
    return this.http.get<TRecord>(`${this.base}/${id}`);
  }

  create(body: TBody, context?: HttpContext): Observable<TRecord> {
    return this.http.post<TRecord>(this.base, body, { context });
  }

  update(id: number, body: TBody, context?: HttpContext): Observable<TRecord> {
    return this.http.put<TRecord>(`${this.base}/${id}`, body, { context });
  }

  archive(id: number): Observable<TRecord> {
    return this.http.post<TRecord>(`${this.base}/${id}/archive`, {});
  }

  unarchive(id: number): Observable<TRecord> {
    return this.http.post<TRecord>(`${this.base}/${id}/unarchive`, {});
  }

  delete(id: number): Observable<DeleteOutcome> {
    return this.http.delete<DeleteOutcome>(`${this.base}/${id}`);
  }
}

/** Thin typed wrapper around the stock routes: materials, wheels, machines and the wheel-selection table. */
@Injectable({ providedIn: 'root' })
export class StockApi {
  private readonly http = inject(HttpClient);

  readonly materials = new StockResource<MaterialBody, MaterialRecord>(this.http, '/api/materials');
  readonly wheels = new StockResource<WheelBody, WheelRecord>(this.http, '/api/wheels');
  readonly machines = new StockResource<MachineBody, MachineRecord>(this.http, '/api/machines');

  /** Every in-use machine and wheel where the machine can turn the wheel above its marked maximum. */
  speedMismatches(): Observable<SpeedMismatch[]> {
    return this.http.get<SpeedMismatch[]>('/api/stock/speed-mismatches');
  }

  selectionRows(): Observable<SelectionRow[]> {
    return this.http.get<SelectionRow[]>('/api/selection-rows');
  }

  createSelectionRow(body: SelectionRowBody, context?: HttpContext): Observable<SelectionRow> {
    return this.http.post<SelectionRow>('/api/selection-rows', body, { context });
  }

  updateSelectionRow(id: number, body: SelectionRowBody, context?: HttpContext): Observable<SelectionRow> {
    return this.http.put<SelectionRow>(`/api/selection-rows/${id}`, body, { context });
  }

  deleteSelectionRow(id: number): Observable<void> {
    return this.http.delete<void>(`/api/selection-rows/${id}`);
  }

  /** The lab's limits the computations and checks use. */
  limits(): Observable<LabLimits> {
    return this.http.get<LabLimits>('/api/settings/limits');
  }
}
