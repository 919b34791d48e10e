import { HttpClient, type HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MessageDto, Page, UserDto } from '@shared/api-types';
import type { CreateUserBody, InviteBody, UpdateUserBody, UserListQuery } from '@shared/schemas/users';

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

  /** The person gets a mail with a 72 h link to set their own password. */
  invite(body: InviteBody, context?: HttpContext): Observable<UserDto> {
    return this.http.post<UserDto>('/api/users/invitations', body, { context });
  }

  /** Voids the older link and mails a new one. */
  resendInvitation(id: number): Observable<MessageDto> {
    return this.http.post<MessageDto>(`/api/users/${id}/invitation`, {});
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
