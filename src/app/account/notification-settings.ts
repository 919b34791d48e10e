import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, type OnInit, computed, inject, signal } from '@angular/core';
import { MatSlideToggleModule, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import { firstValueFrom } from 'rxjs';
import type { NotificationPreferenceDto, NotificationPreferencesDto } from '@shared/api-types';
import type { NotificationPreferencesBody } from '@shared/schemas/mail';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';

/**
 * "Mail notifications" on My account: one switch per kind of mail. The mail asking an
 * operator to acknowledge a new version cannot be turned off: operators must acknowledge
 * every new version for their machines, and the mail is how they learn of it.
 */
@Component({
  selector: 'kb-notification-settings',
  imports: [MatSlideToggleModule],
  template: `
    <section class="kb-panel" aria-labelledby="kb-notifications-title">
      <h2 id="kb-notifications-title" class="kb-section-title">Mail notifications</h2>
      @if (!hasEmail()) {
        <p class="kb-muted" data-testid="no-email">
          There is no e-mail address on your account, so Kerfbook cannot mail you. Ask an admin of your lab to add one.
        </p>
      }
      @if (loadFailed()) {
        <p class="kb-form-error" role="alert">The settings could not be loaded. Reload the page to try again.</p>
      } @else if (items().length === 0) {
        <p class="kb-muted" role="status">Loading…</p>
      } @else {
        <p class="kb-muted">Choose which mails you get about work in Kerfbook.</p>
        <ul class="kb-kinds">
          @for (item of items(); track item.kind) {
            <li [attr.data-kind]="item.kind">
              <mat-slide-toggle
                [checked]="item.enabled"
                [disabled]="!item.optional || saving() === item.kind"
                [attr.aria-describedby]="'kb-kind-note-' + item.kind"
                (change)="toggle(item, $event)"
              >
                {{ item.label }}
              </mat-slide-toggle>
              <span class="kb-note" [id]="'kb-kind-note-' + item.kind">
                For {{ item.audience }}.
                @if (!item.optional) {
                  Always sent: you must acknowledge new versions for your machines.
                }
              </span>
            </li>
          }
        </ul>
      }
    </section>
  `,
  styleUrl: './account.scss',
  styles: `
    .kb-kinds {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 12px;
    }
    .kb-note {
      display: block;
      margin-left: 52px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationSettings implements OnInit {
  private readonly http = inject(HttpClient);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);

  protected readonly items = signal<NotificationPreferenceDto[]>([]);
  protected readonly loadFailed = signal(false);
  /** The kind being saved; its switch waits for the answer. */
  protected readonly saving = signal<string | null>(null);
  protected readonly hasEmail = computed(() => !!this.session.user()?.email);

  async ngOnInit(): Promise<void> {
    try {
      const answer = await firstValueFrom(this.http.get<NotificationPreferencesDto>('/api/session/notifications'));
      this.items.set(answer.items);
    } catch {
      // The error interceptor has told the user why.
      this.loadFailed.set(true);
    }
  }

  protected async toggle(item: NotificationPreferenceDto, change: MatSlideToggleChange): Promise<void> {
    const enabled = change.checked;
    const body: NotificationPreferencesBody = { [item.kind]: enabled };
    this.saving.set(item.kind);
    try {
      const answer = await firstValueFrom(this.http.patch<NotificationPreferencesDto>('/api/session/notifications', body));
      this.items.set(answer.items);
      const message = enabled ? `You will get mails for "${item.label}".` : `No more mails for "${item.label}".`;
      void this.notifier.show(message, 'OK', 4000);
    } catch {
      // The error interceptor has told the user why; show the setting that is really stored.
      change.source.checked = item.enabled;
    } finally {
      this.saving.set(null);
    }
  }
}
