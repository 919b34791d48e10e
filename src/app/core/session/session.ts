import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { CsrfDto, SessionDto, UnitPreference, UserDto } from '@shared/api-types';
import type { Role } from '@shared/roles';
import type { ChangePasswordBody } from '@shared/schemas/session';
import { isApiError } from '../http/api-error';
import { callerHandles } from '../http/caller-handles';

/**
 * Who is signed in, and the CSRF token for the current server session. State is held in
 * private signals and exposed read-only; only the methods here change it.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);

  private readonly currentUser = signal<UserDto | null>(null);
  private readonly token = signal<string | null>(null);
  private readonly outboxKept = signal(false);
  private readonly usernameForSignature = signal(true);

  readonly user = this.currentUser.asReadonly();
  readonly csrfToken = this.token.asReadonly();
  readonly isSignedIn = computed(() => this.currentUser() !== null);
  readonly roles = computed<readonly Role[]>(() => this.currentUser()?.roles ?? []);
  readonly mustChangePassword = computed(() => this.currentUser()?.mustChangePassword ?? false);
  /** True when the server keeps a development outbox (never in production). */
  readonly devOutbox = this.outboxKept.asReadonly();
  /**
   * True until a signing with username and password is completed in this server session:
   * the signature dialog then asks for the username too (21 CFR 11.200(a)(1)).
   */
  readonly signatureNeedsUsername = this.usernameForSignature.asReadonly();

  /**
   * Finds out who is signed in. A 401 means nobody: then fetch the anonymous session's
   * token, which signing in needs. Never rejects, so the app starts even if the server is down.
   */
  async load(): Promise<void> {
    try {
      this.apply(await firstValueFrom(this.http.get<SessionDto>('/api/session', { context: callerHandles(401) })));
    } catch (e) {
      this.clear();
      if (isApiError(e) && e.status === 401) await this.refreshAnonymousToken().catch(() => undefined);
    }
  }

  /**
   * Signs in. The caller shows 400/401/403/429 answers in its form. If the anonymous token has
   * gone stale (CSRF_INVALID), fetch a fresh one and try once more.
   */
  async signIn(username: string, password: string): Promise<UserDto> {
    if (!this.token()) await this.refreshAnonymousToken();
    const post = () => firstValueFrom(this.http.post<SessionDto>('/api/session', { username, password }, { context: callerHandles(400, 401, 403, 429) }));
    let session: SessionDto;
    try {
      session = await post();
    } catch (e) {
      if (!(isApiError(e) && e.code === 'CSRF_INVALID')) throw e;
      await this.refreshAnonymousToken();
      session = await post();
    }
    this.apply(session);
    return session.user;
  }

  /** Ends the server session; the local state is cleared even if the server call fails. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.delete<void>('/api/session', { context: callerHandles(401) }));
    } finally {
      this.clear();
    }
  }

  /** Changes the signed-in user's password; the caller shows 400/401/403/429 (too many wrong passwords) answers in its form. */
  async changePassword(body: ChangePasswordBody): Promise<UserDto> {
    const session = await firstValueFrom(this.http.post<SessionDto>('/api/session/password', body, { context: callerHandles(400, 401, 403, 429) }));
    this.apply(session);
    return session.user;
  }

  async setUnits(units: UnitPreference): Promise<UserDto> {
    const session = await firstValueFrom(this.http.patch<SessionDto>('/api/session/preferences', { units }));
    this.apply(session);
    return session.user;
  }

  /**
   * A POST that works signed out (forgot password, set a password from a mail link): fetches
   * the anonymous session's CSRF token first if there is none, and once more if it has gone
   * stale. The caller shows every error itself (`handles` plus the 403 of a stale token).
   */
  async postAnonymous<T>(url: string, body: unknown, ...handles: number[]): Promise<T> {
    if (!this.token()) await this.refreshAnonymousToken();
    const post = () => firstValueFrom(this.http.post<T>(url, body, { context: callerHandles(...handles, 403) }));
    try {
      return await post();
    } catch (e) {
      if (!(isApiError(e) && e.code === 'CSRF_INVALID')) throw e;
      await this.refreshAnonymousToken();
      return post();
    }
  }

  /** A signing was accepted: later ones in this session take the password only. */
  noteFullSigning(): void {
    this.usernameForSignature.set(false);
  }

  /** The server asked for the username with a signature (e.g. its session began anew). */
  noteUsernameNeeded(): void {
    this.usernameForSignature.set(true);
  }

  /** Forget the user locally (the server said the session is gone, or we signed out). */
  clear(): void {
    this.currentUser.set(null);
    this.token.set(null);
    this.outboxKept.set(false);
    this.usernameForSignature.set(true);
  }

  private async refreshAnonymousToken(): Promise<void> {
    const { csrfToken } = await firstValueFrom(this.http.get<CsrfDto>('/api/session/csrf'));
    this.token.set(csrfToken);
  }

  private apply(session: SessionDto): void {
    this.currentUser.set(session.user);
    this.token.set(session.csrfToken);
    this.outboxKept.set(session.devOutbox === true);
    this.usernameForSignature.set(session.signatureNeedsUsername !== false);
  }
}
