import { DatePipe, DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, type OnInit, inject, signal } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { OutboxEntryDto } from '../../../shared/api-types';
import { type MailTextPart, mailTextLines } from './mail-text';

/**
 * Development only: the mails the server queued, newest first, to check that a mail went
 * out and to follow its links without a real mailbox. A production server answers 404.
 */
@Component({
  selector: 'kb-outbox',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './outbox.html',
  styleUrl: './outbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox implements OnInit {
  private readonly http = inject(HttpClient);
  private readonly origin = inject(DOCUMENT).location.origin;

  protected readonly columns = ['expand', 'to', 'subject', 'kind', 'created', 'delivery'];
  protected readonly items = signal<OutboxEntryDto[]>([]);
  protected readonly loading = signal(false);
  protected readonly loadFailed = signal(false);
  protected readonly expandedId = signal<number | null>(null);

  ngOnInit(): void {
    void this.refresh();
  }

  protected async refresh(): Promise<void> {
    this.loading.set(true);
    try {
      const answer = await firstValueFrom(this.http.get<{ items: OutboxEntryDto[] }>('/api/dev/outbox'));
      this.items.set(answer.items);
      this.loadFailed.set(false);
    } catch {
      // The error interceptor has told the user why.
      this.loadFailed.set(true);
    } finally {
      this.loading.set(false);
    }
  }

  protected toggle(entry: OutboxEntryDto): void {
    this.expandedId.update((id) => (id === entry.id ? null : entry.id));
  }

  protected lines(entry: OutboxEntryDto): MailTextPart[][] {
    return mailTextLines(entry.text, this.origin);
  }
}
