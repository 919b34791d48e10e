import { Injectable, inject, signal } from '@angular/core';
import type { DateFormat } from '@shared/vocabulary';
import { LabSettingsApi } from '../api/lab-settings-api';
import { callerHandles } from '../http/caller-handles';

/** How long a failed ask (signed out, server away) keeps ISO before the next date shown asks again. */
const RETRY_AFTER_MS = 30_000;

/**
 * The lab's date format, asked for once when a date is first shown (ISO until it arrives, or
 * if the request fails); the settings screen sets it after a save. A signed-out page (a
 * password link) gets 401 and shows ISO: the ask handles that itself rather than sending the
 * visitor to the sign-in page, and waits before asking again, because the `labDate` pipe asks
 * on every change detection.
 */
@Injectable({ providedIn: 'root' })
export class LabDateFormat {
  private readonly api = inject(LabSettingsApi);
  private readonly current = signal<DateFormat>('iso');
  private asked = false;
  private failedAt = 0;

  /** The format to use now; the first call asks the server. */
  format(): DateFormat {
    if (!this.asked && Date.now() - this.failedAt >= RETRY_AFTER_MS) {
      this.asked = true;
      this.api.get(callerHandles(401)).subscribe({
        next: (s) => this.current.set(s.dateFormat),
        error: () => {
          this.asked = false;
          this.failedAt = Date.now();
        },
      });
    }
    return this.current();
  }

  set(format: DateFormat): void {
    this.asked = true;
    this.current.set(format);
  }
}
