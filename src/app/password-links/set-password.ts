import { ChangeDetectionStrategy, Component, type OnInit, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import type { LinkInfoDto, MessageDto } from '@shared/api-types';
import { PASSWORD_MIN, newPassword } from '@shared/schemas/fields';
import { linkToken } from '@shared/schemas/mail';
import { controlMessage } from '../core/forms/control-message';
import { sameAsNewPassword } from '../core/forms/same-as-new-password';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { type ApiError, isApiError } from '../core/http/api-error';
import { Session } from '../core/session/session';
import { type LinkProblem, linkProblem } from './link-problem';
import { LabDatePipe } from '../core/dates/lab-date-pipe';

/**
 * Public: the page an invitation or password-reset mail links to (/set-password?token=…).
 * First asks the server what the link is for, then lets the person choose a password.
 */
@Component({
  selector: 'kb-set-password',
  imports: [LabDatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ReactiveFormsModule, RouterLink],
  templateUrl: './set-password.html',
  styleUrls: ['../ui/public-card.scss', './link-pages.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetPassword implements OnInit {
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Bound from the query string. */
  readonly token = input<string>();

  protected readonly passwordMin = PASSWORD_MIN;
  protected readonly controlMessage = controlMessage;
  protected readonly info = signal<LinkInfoDto | null>(null);
  protected readonly problem = signal<LinkProblem | null>(null);
  /** A failure that is not about the link (server down): the page offers to try again. */
  protected readonly loadError = signal('');
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly form = inject(NonNullableFormBuilder).group({
    newPassword: ['', [Validators.required, zodValidator(newPassword)]],
    repeatPassword: ['', [Validators.required, sameAsNewPassword]],
  });

  constructor() {
    // Re-check the repeat field whenever the password it must match changes.
    this.form.controls.newPassword.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe(() => this.form.controls.repeatPassword.updateValueAndValidity({ emitEvent: false }));
  }

  ngOnInit(): void {
    void this.inspect();
  }

  /** POST /api/password/link: what the link is for, or why it cannot be used. */
  protected async inspect(): Promise<void> {
    this.loadError.set('');
    const token = this.cleanToken();
    if (!token) {
      this.problem.set(linkProblem('LINK_INVALID'));
      return;
    }
    this.busy.set(true);
    try {
      this.info.set(await this.session.postAnonymous<LinkInfoDto>('/api/password/link', { token }, 400, 410, 429));
    } catch (e) {
      if (!this.showLinkProblem(e)) this.loadError.set(isApiError(e) ? e.generalMessage : 'The link could not be checked.');
    } finally {
      this.busy.set(false);
    }
  }

  protected async setPassword(): Promise<void> {
    this.formError.set('');
    const info = this.info();
    const token = this.cleanToken();
    if (!info || !token) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      await this.session.postAnonymous<MessageDto>('/api/password/set', { token, newPassword: this.form.getRawValue().newPassword }, 400, 410, 429);
      await this.router.navigate(['/sign-in'], { queryParams: { username: info.username, passwordSet: 'yes' } });
    } catch (e) {
      if (this.showLinkProblem(e)) return;
      if (isApiError(e) && e.status === 400) {
        this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
      } else {
        this.formError.set(isApiError(e) ? e.generalMessage : 'Setting the password failed. Try again.');
      }
    } finally {
      this.busy.set(false);
    }
  }

  /** The token if it has the shape of one; a mangled link is refused without asking the server. */
  private cleanToken(): string | null {
    const parsed = linkToken.safeParse(this.token() ?? '');
    return parsed.success ? parsed.data : null;
  }

  /** True when the error says the link is unusable (then the page explains what to do). */
  private showLinkProblem(e: unknown): boolean {
    if (!isApiError(e)) return false;
    const problem = linkProblem(e.code) ?? (isTokenFieldError(e) ? linkProblem('LINK_INVALID') : null);
    if (!problem) return false;
    this.info.set(null);
    this.problem.set(problem);
    return true;
  }
}

function isTokenFieldError(e: ApiError): boolean {
  return e.status === 400 && e.errors.some((err) => err.path === 'token');
}
