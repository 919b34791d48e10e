import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PowerPoint } from '@shared/cutting-power';
import { formatQuantity } from '@shared/units';
import { axis, label } from './cut-profile-plot';
import { PlotAxes } from './plot-axes';

/** Plot area inside the SVG's viewBox (user units): a smaller companion of the cut profile plot. */
const VIEW = { width: 420, height: 190 };
const PAD = { left: 48, right: 56, top: 30, bottom: 40 };
const PLOT = { x0: PAD.left, x1: VIEW.width - PAD.right, y0: VIEW.height - PAD.bottom, y1: PAD.top };

/** The motor's lines are drawn when the lab's warning line is within this many times the peak; beyond, the curve would be a flat line at the bottom. */
const MOTOR_ON_SCALE_WITHIN = 2;

const power = (w: number) => formatQuantity(w, 'power', 'metric');

/**
 * Cutting power (W or kW) against depth into the cut (mm), beside the removal rate it is
 * made from: a small inline SVG. The motor's power and the lab's warning share of it are
 * drawn as reference lines when they are on the same scale as the cut; otherwise the
 * caption says where they are. Power, warning line and motor line differ by line style and
 * are named in text, never by colour alone; the aria-label gives the figures in words.
 */
@Component({
  selector: 'kb-cut-power-plot',
  templateUrl: './cut-power-plot.html',
  styleUrls: ['./plot-frame.scss', './plot-axes.scss', './cut-power-plot.scss'],
  imports: [PlotAxes],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutPowerPlot {
  /** Power along the cut (RecipeComputed's cutPower.powerProfile). */
  readonly points = input.required<readonly PowerPoint[]>();
  /** The machine's motor power, W, or null when it is not recorded. */
  readonly motorPowerW = input<number | null>(null);
  /** The lab's warning share of the motor's power, %. */
  readonly warningSharePct = input.required<number>();

  protected readonly view = VIEW;
  protected readonly plot = PLOT;

  private readonly usable = computed(() => this.points().filter((p) => Number.isFinite(p.depthMm) && Number.isFinite(p.powerW)));
  protected readonly hasData = computed(() => this.usable().length >= 2 && this.usable().some((p) => p.depthMm > 0));

  private readonly figures = computed(() => {
    const pts = this.usable();
    const peak = pts.reduce((a, b) => (b.powerW > a.powerW ? b : a), pts[0] ?? { depthMm: 0, powerW: 0 });
    const motor = this.motorPowerW();
    const warnW = motor === null ? null : (motor * this.warningSharePct()) / 100;
    const motorOnScale = motor !== null && warnW !== null && peak.powerW > 0 && warnW <= MOTOR_ON_SCALE_WITHIN * peak.powerW;
    return { peak, motor, warnW, motorOnScale, depth: Math.max(0, ...pts.map((p) => p.depthMm)) };
  });

  protected readonly chart = computed(() => {
    const pts = this.usable();
    const { peak, motor, warnW, motorOnScale, depth } = this.figures();
    const top = motorOnScale ? Math.max(peak.powerW, motor!) : peak.powerW;
    const inKw = top >= 1000;
    const div = inKw ? 1000 : 1;
    const x = axis(depth, PLOT.x0, PLOT.x1);
    const y = axis(top / div, PLOT.y0, PLOT.y1, 1.08);
    return {
      x,
      y,
      unit: inKw ? 'kW' : 'W',
      powerPath: pts.map((p, i) => `${i ? 'L' : 'M'}${x.scale(p.depthMm).toFixed(1)},${y.scale(p.powerW / div).toFixed(1)}`).join(' '),
      warnY: motorOnScale ? y.scale(warnW! / div) : null,
      motorY: motorOnScale ? y.scale(motor! / div) : null,
    };
  });

  /** Where the motor's lines are when they are not drawn, or null. */
  protected readonly offScale = computed(() => {
    const { motor, warnW, motorOnScale } = this.figures();
    if (motor === null) return "The machine's motor power is not recorded: no motor line.";
    if (motorOnScale) return null;
    return `The motor (${power(motor)}) and the lab's ${this.warningSharePct()} % line (${power(warnW!)}) lie above this scale.`;
  });

  protected readonly shareText = computed(() => `${this.warningSharePct()} % of the motor (${power(this.figures().warnW ?? 0)})`);
  protected readonly motorText = computed(() => `Motor ${power(this.motorPowerW() ?? 0)}`);

  protected readonly summary = computed(() => {
    if (!this.hasData()) return 'Cutting power: not enough values yet to plot it.';
    const { peak, motor, depth } = this.figures();
    const share =
      motor === null
        ? "the machine's motor power is not recorded"
        : `${((peak.powerW / motor) * 100).toFixed(0)} % of the ${power(motor)} motor; the lab warns above ${this.warningSharePct()} %`;
    return `Cutting power over ${label(depth)} mm of depth: peaks at ${power(peak.powerW)} at ${label(peak.depthMm)} mm deep, ${share}.`;
  });
}
