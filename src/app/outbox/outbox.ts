import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { HttpClient } from '@angular/common/http';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { map } from 'rxjs';
import { latestValue } from '../core/api/latest-value';
import type { OutboxEntryDto } from '@shared/api-types';
import { type MailTextPart, mailTextLines } from './mail-text';
import { LabDatePipe } from '../core/dates/lab-date-pipe';

/**
 * Development only: the mails the server queued, newest first, to check that a mail went
 * out and to follow its links without a real mailbox. A production server answers 404.
 */
@Component({
  selector: 'kb-outbox',
  imports: [LabDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './outbox.html',
  styleUrl: './outbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox {
  private readonly http = inject(HttpClient);
  private readonly origin = inject(DOCUMENT).location.origin;

  protected readonly columns = ['expand', 'to', 'subject', 'kind', 'created', 'delivery'];
  private readonly outbox = rxResource({ stream: () => this.http.get<{ items: OutboxEntryDto[] }>('/api/dev/outbox').pipe(map((answer) => answer.items)) });
  /** The mails last listed; they stay while the list is asked again and when that fails. */
  protected readonly items = latestValue<OutboxEntryDto[]>(this.outbox, []);
  protected readonly loading = computed(() => this.outbox.isLoading());
  /** The error interceptor has told the user why. */
  protected readonly loadFailed = computed(() => !!this.outbox.error());
  protected readonly expandedId = signal<number | null>(null);

  protected refresh(): void {
    this.outbox.reload();
  }

  protected toggle(entry: OutboxEntryDto): void {
    this.expandedId.update((id) => (id === entry.id ? null : entry.id));
  }

  protected lines(entry: OutboxEntryDto): MailTextPart[][] {
    return mailTextLines(entry.text, this.origin);
  }

  /**
   * The delivery tries made. The outbox counts failed tries only, so a sent mail had one more:
   * it never reads "0 attempts".
   */
  protected tries(entry: OutboxEntryDto): string {
    const n = entry.attempts + (entry.sent ? 1 : 0);
    if (n === 0) return 'not tried yet';
    return `${n} ${n === 1 ? 'attempt' : 'attempts'}`;
  }
}
