import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';
import type { MessageDto } from '@shared/api-types';
import { requiredEmail } from '@shared/schemas/mail';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { Session } from '../core/session/session';

/**
 * Public: ask for a password-reset link by e-mail. The server answers the same whether or
 * not the address belongs to an account, so this page only ever repeats its message.
 */
@Component({
  selector: 'kb-forgot-password',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ReactiveFormsModule, RouterLink],
  templateUrl: './forgot-password.html',
  styleUrls: ['../ui/public-card.scss', './link-pages.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPassword {
  private readonly session = inject(Session);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, zodValidator(requiredEmail)]],
  });
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  /** The server's answer once sent; the form gives way to it. */
  protected readonly sentMessage = signal('');
  protected readonly controlMessage = controlMessage;

  protected async send(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      const answer = await this.session.postAnonymous<MessageDto>('/api/password/forgot', { email: this.form.getRawValue().email.trim() }, 400, 429);
      this.sentMessage.set(answer.message || 'If that address belongs to an account, a link is on its way.');
    } catch (e) {
      if (!isApiError(e)) {
        this.formError.set('Sending failed. Try again.');
      } else if (e.status === 400) {
        this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
      } else {
        this.formError.set(e.generalMessage || 'Sending failed. Try again.');
      }
    } finally {
      this.busy.set(false);
    }
  }
}
