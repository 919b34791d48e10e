import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { Axis } from './cut-profile-plot';

/** The plot area inside a plot's viewBox (user units): x0–x1 left to right, y0 the bottom, y1 the top. */
export interface PlotArea {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/**
 * The frame both cut plots share, drawn into their SVG: horizontal grid lines at the value
 * ticks, the bottom and left axes with their tick labels, and the depth axis's title. Each
 * plot adds its own series, right-hand axis or reference lines beside it.
 */
@Component({
  // Drawn inside an <svg>: an element of its own would not render there, so it sits on a <g>.
  // eslint-disable-next-line @angular-eslint/component-selector
  selector: 'g[kbPlotAxes]',
  template: `
    <svg:g class="kb-grid">
      @for (t of y().ticks; track t.value) {
        <svg:line [attr.x1]="plot().x0" [attr.x2]="plot().x1" [attr.y1]="t.pos" [attr.y2]="t.pos" />
      }
    </svg:g>
    <svg:g class="kb-axis">
      <svg:line [attr.x1]="plot().x0" [attr.x2]="plot().x1" [attr.y1]="plot().y0" [attr.y2]="plot().y0" />
      <svg:line [attr.x1]="plot().x0" [attr.x2]="plot().x0" [attr.y1]="plot().y0" [attr.y2]="plot().y1" />
      @for (t of x().ticks; track t.value) {
        <svg:line [attr.x1]="t.pos" [attr.x2]="t.pos" [attr.y1]="plot().y0" [attr.y2]="plot().y0 + 4" />
        <svg:text [attr.x]="t.pos" [attr.y]="plot().y0 + 15" text-anchor="middle">{{ t.text }}</svg:text>
      }
      @for (t of y().ticks; track t.value) {
        <svg:text [attr.x]="plot().x0 - 6" [attr.y]="t.pos + 3.5" text-anchor="end">{{ t.text }}</svg:text>
      }
      <svg:text class="kb-axis-title" [attr.x]="(plot().x0 + plot().x1) / 2" [attr.y]="height() - 6" text-anchor="middle">{{ xTitle() }}</svg:text>
    </svg:g>
  `,
  styleUrl: './plot-axes.scss',
  host: { 'aria-hidden': 'true' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlotAxes {
  readonly plot = input.required<PlotArea>();
  /** The viewBox's height: the depth axis's title sits at its foot. */
  readonly height = input.required<number>();
  readonly x = input.required<Axis>();
  /** The left-hand value axis; the grid lines follow its ticks. */
  readonly y = input.required<Axis>();
  readonly xTitle = input('Depth into the cut (mm)');
}
