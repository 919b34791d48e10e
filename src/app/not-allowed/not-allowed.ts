import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { ROLE_INFO } from '@shared/roles';
import { Session } from '../core/session/session';

/** Where the access guard sends a signed-in user whose roles do not open the page asked for. */
@Component({
  selector: 'kb-not-allowed',
  imports: [MatButtonModule, RouterLink],
  template: `
    <div class="kb-page kb-message-page">
      <h1 class="kb-page-title">Not allowed</h1>
      <p>
        Your roles do not open
        @if (from()) {
          <code>{{ from() }}</code>.
        } @else {
          that page.
        }
        You hold: {{ roleLabels() }}.
      </p>
      <p>If you need it for your work, ask an admin of your lab to add the role.</p>
      <a matButton="filled" routerLink="/today">Go to Today</a>
    </div>
  `,
  styles: `
    .kb-message-page {
      max-width: 640px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowed {
  private readonly session = inject(Session);

  /** The address that was refused; bound from the query string. */
  readonly from = input<string>();

  protected readonly roleLabels = computed(
    () =>
      this.session
        .roles()
        .map((role) => ROLE_INFO[role].label)
        .join(', ') || 'no role',
  );
}
