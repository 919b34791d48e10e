import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { UnitPreference } from '@shared/api-types';
import type { RecipeComputed } from '@shared/recipe-computations';
import { NO_VALUE, formatQuantity } from '@shared/units';
import { RPM_CAP_LABELS, WORN_DIAMETER_SOURCE_LABELS } from '@shared/vocabulary';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE, WORN_RPM_CAUTION } from '@shared/worn-wheel';

/**
 * The wheel worn to its smallest usable diameter and the kerf loss, as a list of values:
 * capacity and peripheral speed at the worn diameter, the rpm that would hold the new-wheel
 * speed (capped), the kerf. Said in words with an icon, never by colour alone.
 */
@Component({
  selector: 'kb-worn-wheel-values',
  imports: [MatIconModule],
  templateUrl: './worn-wheel-values.html',
  styleUrls: ['../value-list.scss', './worn-wheel-values.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WornWheelValues {
  readonly computed = input.required<RecipeComputed | null>();
  readonly units = input<UnitPreference>('metric');

  protected readonly noValue = NO_VALUE;
  protected readonly caution = WORN_RPM_CAUTION;

  protected readonly worn = computed(() => this.computed()?.wornWheel ?? null);

  /** Where the worn diameter comes from, in words. */
  protected readonly source = computed(() => {
    const w = this.worn();
    if (!w || w.source === null) return '';
    if (w.source === 'wheel' || w.labShare === null) return WORN_DIAMETER_SOURCE_LABELS.wheel;
    const pct = `${Math.round(w.labShare * 100)} %`;
    return w.labShare === KERFBOOK_WORN_DIAMETER_SHARE
      ? `${pct} of the new diameter: the lab's default, Kerfbook's starting value (common practice)`
      : `${pct} of the new diameter: the lab's default`;
  });

  protected readonly held = computed(() => {
    const w = this.worn();
    if (!w || w.rpmToHoldSpeed === null || w.heldRpm === null) return null;
    return {
      wanted: this.q(w.rpmToHoldSpeed, 'rpm'),
      rpm: this.q(w.heldRpm, 'rpm'),
      speed: this.speed(w.heldSpeedMs),
      cap: w.heldRpmCappedBy ? RPM_CAP_LABELS[w.heldRpmCappedBy] : null,
    };
  });

  protected readonly kerf = computed(() => {
    const c = this.computed();
    if (!c || c.kerfLossMm === null || c.kerfAllowanceMm === null) return null;
    const wheel = this.q(c.kerfLossMm - c.kerfAllowanceMm, 'length');
    const allowance = this.q(c.kerfAllowanceMm, 'length');
    const whose = c.kerfAllowanceMm === KERFBOOK_KERF_ALLOWANCE_MM ? "the lab's allowance, Kerfbook's default" : "the lab's allowance";
    return { loss: this.q(c.kerfLossMm, 'length'), parts: `wheel ${wheel} + ${allowance} (${whose})` };
  });

  protected q(value: number | null | undefined, kind: 'length' | 'rpm'): string {
    return formatQuantity(value, kind, this.units());
  }

  /** Peripheral speed always shows both units, as everywhere else in the panel. */
  protected speed(value: number | null | undefined): string {
    return formatQuantity(value, 'speed', 'metric+imperial');
  }

  protected abs(value: number): number {
    return Math.abs(value);
  }
}
