import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { REMOVAL_LENGTH_PER_TURN_NOTE, type ContactPoint } from '@shared/contact-length';
import { CONTACT_MEASURE_LABELS, type ContactMeasure } from '@shared/vocabulary';
import { PlotAxes } from './plot-axes';

/** Plot area inside the SVG's viewBox (user units). */
const VIEW = { width: 420, height: 230 };
const PAD = { left: 48, right: 56, top: 34, bottom: 40 };
const PLOT = { x0: PAD.left, x1: VIEW.width - PAD.right, y0: VIEW.height - PAD.bottom, y1: PAD.top };

/** Rounded tick step: 1, 2, 2.5 or 5 × 10ⁿ, for about `count` ticks up to `max`. */
export function niceTicks(max: number, count = 4): number[] {
  if (!(max > 0) || !Number.isFinite(max)) return [0, 1];
  const raw = max / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * magnitude >= raw) ?? 10) * magnitude;
  const ticks: number[] = [];
  for (let t = 0; t < max + step * 0.999; t += step) ticks.push(Number(t.toPrecision(12)));
  return ticks;
}

export function label(value: number): string {
  if (value === 0) return '0';
  const abs = Math.abs(value);
  return abs >= 100 ? value.toFixed(0) : abs >= 10 ? String(Number(value.toFixed(1))) : String(Number(value.toFixed(2)));
}

export interface Axis {
  ticks: { value: number; pos: number; text: string }[];
  scale: (v: number) => number;
}

/** A value axis; `headroom` keeps a flat line (a rectangular section) off the plot's top edge. */
export function axis(max: number, from: number, to: number, headroom = 1): Axis {
  const ticks = niceTicks(max * headroom);
  const top = ticks[ticks.length - 1] || 1;
  const scale = (v: number) => from + ((to - from) * v) / top;
  return { ticks: ticks.map((value) => ({ value, pos: scale(value), text: label(value) })), scale };
}

function path(points: readonly ContactPoint[], x: Axis, y: Axis, pick: (p: ContactPoint) => number): string {
  return points.map((p, i) => `${i ? 'L' : 'M'}${x.scale(p.depthMm).toFixed(1)},${y.scale(pick(p)).toFixed(1)}`).join(' ');
}

/**
 * Contact length (mm, left axis) and removal rate (mm³/s, right axis) against depth into
 * the cut (mm): a small inline SVG, no chart library. The two series differ by line style as
 * well as colour, and the aria-label gives the peak values in words. When the part turns,
 * the left series is the effective removal length per turn (2π·r), labelled as such: it is
 * not an arc the wheel touches.
 */
@Component({
  selector: 'kb-cut-profile-plot',
  templateUrl: './cut-profile-plot.html',
  styleUrls: ['./plot-frame.scss', './plot-axes.scss', './cut-profile-plot.scss'],
  imports: [PlotAxes],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutProfilePlot {
  /** Samples from entry to the end of the cut (RecipeComputed's profile). */
  readonly points = input.required<readonly ContactPoint[]>();
  /** What the left series is (RecipeComputed's profileMeasure). */
  readonly measure = input<ContactMeasure>('contact-length');

  protected readonly lengthLabel = computed(() => CONTACT_MEASURE_LABELS[this.measure()]);
  /** Said under the plot when the length is not a contact arc. */
  protected readonly lengthNote = computed(() => (this.measure() === 'removal-length-per-turn' ? REMOVAL_LENGTH_PER_TURN_NOTE : null));

  protected readonly view = VIEW;
  protected readonly plot = PLOT;

  private readonly usable = computed(() => this.points().filter((p) => [p.depthMm, p.contactMm, p.removalMm3S].every(Number.isFinite)));
  protected readonly hasData = computed(() => this.usable().length >= 2 && this.usable().some((p) => p.depthMm > 0));

  private readonly peaks = computed(() => {
    const pts = this.usable();
    const byContact = pts.reduce((a, b) => (b.contactMm > a.contactMm ? b : a), pts[0]);
    const byRemoval = pts.reduce((a, b) => (b.removalMm3S > a.removalMm3S ? b : a), pts[0]);
    return { byContact, byRemoval, depth: Math.max(...pts.map((p) => p.depthMm)) };
  });

  protected readonly chart = computed(() => {
    const pts = this.usable();
    const { byContact, byRemoval, depth } = this.peaks();
    const x = axis(depth, PLOT.x0, PLOT.x1);
    const left = axis(byContact.contactMm, PLOT.y0, PLOT.y1, 1.08);
    const right = axis(byRemoval.removalMm3S, PLOT.y0, PLOT.y1, 1.08);
    return {
      x,
      left,
      right,
      contactPath: path(pts, x, left, (p) => p.contactMm),
      removalPath: path(pts, x, right, (p) => p.removalMm3S),
    };
  });

  protected readonly summary = computed(() => {
    const length = this.lengthLabel().toLowerCase();
    if (!this.hasData()) return `Cut profile: not enough values yet to plot ${length} and removal rate.`;
    const { byContact, byRemoval, depth } = this.peaks();
    return (
      `Cut profile over ${label(depth)} mm of depth: ${length} peaks at ${label(byContact.contactMm)} mm ` +
      `at ${label(byContact.depthMm)} mm deep; removal rate peaks at ${label(byRemoval.removalMm3S)} mm³/s ` +
      `at ${label(byRemoval.depthMm)} mm deep.`
    );
  });
}
