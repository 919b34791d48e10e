import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { UnitPreference } from '@shared/api-types';
import { motorShareText, type CutPower } from '@shared/cutting-power';
import { formatQuantity, type QuantityKind } from '@shared/units';
import { CUT_POWER_LABELS } from '@shared/vocabulary';

/** How the peak power stands against the motor. */
type MotorState = 'no-energy' | 'motor-unknown' | 'within' | 'above';

/**
 * The cutting power figures of a recipe — peak power with its share of the motor, the
 * tangential force, the equivalent chip thickness and the specific energy they rest on —
 * in the editor's panel and on the recipe page alike. The state against the motor is said
 * in words and with an icon, never by colour alone.
 */
@Component({
  selector: 'kb-cut-power-figures',
  imports: [MatIconModule],
  templateUrl: './cut-power-figures.html',
  styleUrls: ['../value-list.scss', './cut-power-figures.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutPowerFigures {
  readonly power = input.required<CutPower>();
  readonly units = input<UnitPreference>('metric');

  protected readonly labels = CUT_POWER_LABELS;

  protected readonly state = computed<MotorState>(() => {
    const p = this.power();
    if (p.peakPowerW === null) return 'no-energy';
    if (p.motorSharePct === null) return 'motor-unknown';
    return p.motorSharePct > p.warningSharePct ? 'above' : 'within';
  });

  /** "41 % of the 5.50 kW motor", or "More than the 2.20 kW motor". */
  protected readonly share = computed(() => {
    const text = motorShareText(this.power()) ?? '';
    return text.charAt(0).toUpperCase() + text.slice(1);
  });

  protected q(value: number | null | undefined, kind: QuantityKind): string {
    return formatQuantity(value, kind, this.units());
  }
}
