import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { UnitPreference } from '@shared/api-types';
import type { RecipeContent } from '@shared/schemas/recipe';
import type { MachineRecord, WheelRecord } from '@shared/stock-types';
import { CLAMPING_METHOD_LABELS, COOLANT_TYPE_LABELS, CUT_MOTION_LABELS } from '@shared/vocabulary';
import { QuantityPipe } from '../../ui/quantity';
import { motionSettingsText } from '@shared/motion-settings';

/**
 * The settings an operator dials in at the saw, in one compact list: machine, wheel, speeds,
 * motion, clamping and coolant. Stock records are optional; ids stand in until they arrive.
 */
@Component({
  selector: 'kb-key-parameters',
  imports: [QuantityPipe],
  template: `
    @let c = content();
    <dl class="kb-key" [attr.aria-label]="label()">
      <dt>Machine</dt>
      <dd>{{ machine()?.name ?? 'Machine ' + c.cutting.machineId }}</dd>
      <dt>Wheel</dt>
      <dd>
        {{ wheel()?.name ?? 'Wheel ' + c.cutting.wheelId }}
        @if (wheel(); as w) {
          <span class="kb-sub kb-mono">{{ w.specification }}</span>
        }
      </dd>
      <dt>Wheel speed</dt>
      <dd class="kb-num">{{ c.cutting.wheelRpm | quantity: 'rpm' : units() }}</dd>
      <dt>Feed</dt>
      <dd class="kb-num">
        {{ c.cutting.feedMmS | quantity: 'mm/s' : units() }}
        @if (c.cutting.entryFeedMmS !== null) {
          <span class="kb-sub">
            entry {{ c.cutting.entryFeedMmS | quantity: 'mm/s' : units() }}
            @if (c.cutting.entryLengthMm !== null) {
              for the first {{ c.cutting.entryLengthMm | quantity: 'mm' : units() }}
            }
          </span>
        }
      </dd>
      <dt>Cut motion</dt>
      <dd>
        {{ motionLabel[c.cutting.cutMotion] }}
        @if (c.cutting.passes !== null) {
          , {{ c.cutting.passes }} passes
        }
        @if (motionSettings(); as settings) {
          <span class="kb-sub" data-testid="key-motion-settings">{{ settings }}</span>
        }
      </dd>
      <dt>Clamping</dt>
      <dd>
        {{ c.clamping.method ? clampingLabel[c.clamping.method] : '—' }}
        @if (c.clamping.placement) {
          <span class="kb-sub">{{ c.clamping.placement }}</span>
        }
      </dd>
      <dt>Coolant</dt>
      <dd>
        {{ coolantLabel[c.coolant.type] }}
        @if (c.coolant.concentrationPct !== null) {
          <span class="kb-sub">{{ c.coolant.concentrationPct | quantity: '% v/v' : units() }}</span>
        }
      </dd>
    </dl>
  `,
  styles: `
    :host {
      display: block;
    }
    .kb-key {
      display: grid;
      grid-template-columns: minmax(110px, 35%) 1fr;
      gap: 6px 12px;
      margin: 0;
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
    }
    .kb-num {
      font-variant-numeric: tabular-nums;
    }
    .kb-mono {
      font-family: 'Roboto Mono', ui-monospace, monospace;
      font-size: 13px;
    }
    .kb-sub {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyParameters {
  readonly content = input.required<RecipeContent>();
  readonly wheel = input<WheelRecord | null>(null);
  readonly machine = input<MachineRecord | null>(null);
  readonly units = input<UnitPreference>('metric');
  readonly label = input('Key parameters');

  protected readonly motionLabel = CUT_MOTION_LABELS;
  /** The motion's settings in one line (the passes are shown beside the motion already). */
  protected readonly motionSettings = computed(() => {
    const c = this.content();
    return motionSettingsText({ cutting: { ...c.cutting, passes: null } }, this.units());
  });
  protected readonly clampingLabel = CLAMPING_METHOD_LABELS;
  protected readonly coolantLabel = COOLANT_TYPE_LABELS;
}
