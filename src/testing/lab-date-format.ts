import { type EnvironmentProviders, inject, provideEnvironmentInitializer } from '@angular/core';
import type { DateFormat } from '@shared/vocabulary';
import { LabDateFormat } from '../app/core/dates/lab-date-format';

/**
 * The lab's date format as if the server had answered it already (ISO 8601 is a new lab's
 * setting): specs then never leave the format's settings request open, which would hold
 * `whenStable` until the test times out.
 */
export function provideLabDateFormat(format: DateFormat = 'iso'): EnvironmentProviders {
  return provideEnvironmentInitializer(() => inject(LabDateFormat).set(format));
}
