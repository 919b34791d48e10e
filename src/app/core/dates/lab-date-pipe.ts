import { Pipe, type PipeTransform, inject } from '@angular/core';
import { formatDate, formatDateTime } from '@shared/date-format';
import { LabDateFormat } from './lab-date-format';

/**
 * A date in the lab's format: `{{ day | labDate }}` gives "05.12.2026", `{{ at | labDate: 'time' }}`
 * adds the UTC time. Impure, so a changed lab format shows at once; the work is a few string
 * operations.
 */
@Pipe({ name: 'labDate', pure: false })
export class LabDatePipe implements PipeTransform {
  private readonly lab = inject(LabDateFormat);

  transform(value: string | Date | null | undefined, withTime?: 'time'): string {
    const format = this.lab.format();
    return withTime === 'time' ? formatDateTime(value, format) : formatDate(value, format);
  }
}
