import { HttpClient, type HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, UserDto } from '../../../shared/api-types';
import type { CreateUserBody, UpdateUserBody, UserListQuery } from '../../../shared/schemas/users';

/** Thin typed wrapper around the admin's `/api/users` routes (DEVELOPERS.md, Foundation routes). */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  /** Empty filters are left out of the query string, so the server applies its defaults. */
  list(query: Partial<UserListQuery>): Observable<Page<UserDto>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<Page<UserDto>>('/api/users', { params });
  }

  get(id: number): Observable<UserDto> {
    return this.http.get<UserDto>(`/api/users/${id}`);
  }

  create(body: CreateUserBody, context?: HttpContext): Observable<UserDto> {
    return this.http.post<UserDto>('/api/users', body, { context });
  }

  update(id: number, body: UpdateUserBody, context?: HttpContext): Observable<UserDto> {
    return this.http.patch<UserDto>(`/api/users/${id}`, body, { context });
  }

  deactivate(id: number): Observable<UserDto> {
    return this.http.post<UserDto>(`/api/users/${id}/deactivate`, {});
  }

  reactivate(id: number): Observable<UserDto> {
    return this.http.post<UserDto>(`/api/users/${id}/reactivate`, {});
  }

  setTemporaryPassword(id: number, password: string, context?: HttpContext): Observable<UserDto> {
    return this.http.post<UserDto>(`/api/users/${id}/temporary-password`, { password }, { context });
  }
}
