import { ChangeDetectionStrategy, Component, type OnInit, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import { signInBody } from '@shared/schemas/session';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { homePage } from '../core/session/home-page';
import { safeReturnUrl } from '../core/session/return-url';
import { Session } from '../core/session/session';

/** Words used when the server's answer carries no message of its own. */
const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'That username and password do not match an active account.',
  403: 'This account cannot sign in. Ask an admin of your lab.',
  429: 'Too many sign-in attempts. Wait a few minutes, then try again.',
};

@Component({
  selector: 'kb-sign-in',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ReactiveFormsModule, RouterLink],
  templateUrl: './sign-in.html',
  styleUrl: '../ui/public-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn implements OnInit {
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** Where to go after signing in; bound from the query string. */
  readonly returnUrl = input<string>();
  /** Prefilled after setting a password from a mail link (/sign-in?username=…&passwordSet=yes). */
  readonly username = input<string>();
  readonly passwordSet = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    username: ['', [Validators.required, zodValidator(signInBody.shape.username)]],
    password: ['', [Validators.required, zodValidator(signInBody.shape.password)]],
  });
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly showPassword = signal(false);
  protected readonly controlMessage = controlMessage;

  ngOnInit(): void {
    // Someone already signed in has nothing to do here (inputs are bound by now).
    if (this.session.isSignedIn()) {
      void this.router.navigateByUrl(safeReturnUrl(this.returnUrl(), homePage(this.session.roles())));
      return;
    }
    const username = this.username()?.trim();
    if (username) this.form.controls.username.setValue(username);
  }

  protected togglePasswordVisibility(): void {
    this.showPassword.update((shown) => !shown);
  }

  protected async signIn(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      const { username, password } = this.form.getRawValue();
      const user = await this.session.signIn(username, password);
      // Operators start at the Finder, everyone else at Today, unless a page was asked for.
      const home = homePage(user.roles);
      if (user.mustChangePassword) {
        await this.router.navigate(['/account'], { queryParams: { returnUrl: safeReturnUrl(this.returnUrl(), home) } });
      } else {
        await this.router.navigateByUrl(safeReturnUrl(this.returnUrl(), home));
      }
    } catch (e) {
      this.showFailure(e);
    } finally {
      this.busy.set(false);
    }
  }

  private showFailure(e: unknown): void {
    if (!isApiError(e)) {
      this.formError.set('Signing in failed. Try again.');
      return;
    }
    if (e.status === 400) {
      const rest = applyServerErrors(this.form, e.errors);
      this.formError.set(rest.join(' '));
      return;
    }
    this.formError.set(e.generalMessage || FALLBACK_MESSAGES[e.status] || 'Signing in failed. Try again.');
  }
}
