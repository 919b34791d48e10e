import { Pipe, type PipeTransform } from '@angular/core';
import type { UnitPreference } from '@shared/api-types';
import { markedMaximumText } from '@shared/spindle-speed';
import type { WheelRecord } from '@shared/stock-types';
import { NO_VALUE } from '@shared/units';

type MarkedWheel = Pick<WheelRecord, 'diameterMm' | 'maxSpeedMarkedIn' | 'maxSpeedMs' | 'maxSpeedRpm'>;

/** `{{ wheel | markedMaximum: units() }}` → "80 m/s (marked) · 6111 rpm at 250 mm": the unit marked on the wheel, the other computed. */
@Pipe({ name: 'markedMaximum' })
export class MarkedMaximumPipe implements PipeTransform {
  transform(wheel: MarkedWheel | null | undefined, pref: UnitPreference | undefined): string {
    return wheel ? markedMaximumText(wheel, pref ?? 'metric') : NO_VALUE;
  }
}
