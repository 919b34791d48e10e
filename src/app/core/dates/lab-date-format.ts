import { Injectable, inject, signal } from '@angular/core';
import type { DateFormat } from '@shared/vocabulary';
import { LabSettingsApi } from '../api/lab-settings-api';

/**
 * The lab's date format, asked for once when a date is first shown (ISO until it arrives, or
 * if the request fails); the settings screen sets it after a save.
 */
@Injectable({ providedIn: 'root' })
export class LabDateFormat {
  private readonly api = inject(LabSettingsApi);
  private readonly current = signal<DateFormat>('iso');
  private asked = false;

  /** The format to use now; the first call asks the server. */
  format(): DateFormat {
    if (!this.asked) {
      this.asked = true;
      this.api.get().subscribe({ next: (s) => this.current.set(s.dateFormat), error: () => (this.asked = false) });
    }
    return this.current();
  }

  set(format: DateFormat): void {
    this.asked = true;
    this.current.set(format);
  }
}
