import { Component, signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import type { PowerPoint } from '@shared/cutting-power';
import { CutPowerPlot } from './cut-power-plot';

@Component({
  imports: [CutPowerPlot],
  template: `<kb-cut-power-plot [points]="points()" [motorPowerW]="motor()" [warningSharePct]="share()" />`,
})
class Host {
  readonly points = signal<readonly PowerPoint[]>([]);
  readonly motor = signal<number | null>(null);
  readonly share = signal(80);
}

/**
 * A Ø60 bar, 2.5 mm wheel at 0.5 mm/s, 40 J/mm³: P = 0.5 × 2.5 × 2·√(x·(60 − x)) × 40 W
 * (removal rate × specific energy), peak 3000 W at 30 mm deep; computed by hand.
 */
function bar(): PowerPoint[] {
  return [0, 15, 30, 45, 60].map((x) => ({ depthMm: x, powerW: 0.5 * 2.5 * 2 * Math.sqrt(x * (60 - x)) * 40 }));
}

describe('CutPowerPlot', () => {
  let fixture: ComponentFixture<Host>;
  let root: HTMLElement;

  async function plot(points: readonly PowerPoint[], motor: number | null, share = 80): Promise<void> {
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.points.set(points);
    fixture.componentInstance.motor.set(motor);
    fixture.componentInstance.share.set(share);
    await fixture.whenStable();
    root = fixture.nativeElement;
  }

  const label = () => root.querySelector('svg[role="img"]')!.getAttribute('aria-label')!;

  it('draws the power through every depth, in kW above 1000 W, with the motor and the warning line on the scale', async () => {
    await plot(bar(), 5500);
    const d = root.querySelector('path[data-series="power"]')!.getAttribute('d')!;
    expect(d.match(/[ML]/g)).toHaveLength(5);
    expect(root.querySelector('[data-testid="power-unit"]')!.textContent).toBe('kW');
    // 80 % of 5500 W = 4400 W (under 2 × the 3000 W peak), so both reference lines are drawn, the motor's above.
    const motor = Number(root.querySelector('line[data-line="motor"]')!.getAttribute('y1'));
    const warn = Number(root.querySelector('line[data-line="warning"]')!.getAttribute('y1'));
    expect(motor).toBeLessThan(warn);
    const peakY = Math.min(...d.split(' ').map((s) => Number(s.slice(1).split(',')[1])));
    expect(warn).toBeLessThan(peakY);
    const text = root.textContent ?? '';
    expect(text).toContain('Depth into the cut (mm)');
    expect(text).toContain('Cutting power (kW)');
    expect(text).toContain("Lab's warning line: 80 % of the motor (4.40 kW)");
    expect(text).toContain('Motor 5.50 kW');
  });

  it('draws the shared axes as SVG: a grid line and a label per value tick (0–6 kW: 5.5 kW motor × 1.08 headroom, steps of 2), and depth ticks 0–60 mm', async () => {
    await plot(bar(), 5500);
    const svgNs = 'http://www.w3.org/2000/svg';
    const grid = [...root.querySelectorAll('.kb-grid line')];
    expect(grid).toHaveLength(4);
    expect(grid.every((l) => l.namespaceURI === svgNs)).toBe(true);
    const texts = [...root.querySelectorAll('.kb-axis text')].map((t) => t.textContent?.trim());
    expect(texts).toEqual(expect.arrayContaining(['0', '20', '40', '60', '2', '4', '6', 'Depth into the cut (mm)']));
  });

  it('gives the peak and the share of the motor in words (3000 W of 5500 W = 55 %)', async () => {
    await plot(bar(), 5500);
    expect(label()).toBe('Cutting power over 60 mm of depth: peaks at 3.00 kW at 30 mm deep, 55 % of the 5.50 kW motor; the lab warns above 80 %.');
  });

  it('says where the motor is when it lies far above the cut, and plots in W below 1000 W', async () => {
    // A precision cut: 10 W peak on a 750 W motor; 80 % of it is 600 W, far above the curve.
    await plot(
      bar().map((p) => ({ ...p, powerW: p.powerW / 300 })),
      750,
    );
    expect(root.querySelector('line[data-line="motor"]')).toBeNull();
    expect(root.querySelector('[data-testid="power-unit"]')!.textContent).toBe('W');
    expect(root.querySelector('[data-testid="power-off-scale"]')!.textContent).toContain(
      "The motor (750 W) and the lab's 80 % line (600 W) lie above this scale.",
    );
  });

  it('says when the motor power is not recorded', async () => {
    await plot(bar(), null);
    expect(root.querySelector('line[data-line]')).toBeNull();
    expect(root.querySelector('[data-testid="power-off-scale"]')!.textContent).toContain("The machine's motor power is not recorded");
    expect(label()).toContain("the machine's motor power is not recorded");
  });

  it('says what is missing instead of drawing an empty plot', async () => {
    await plot([{ depthMm: 0, powerW: 0 }], 5500);
    expect(root.querySelector('path[data-series]')).toBeNull();
    expect(label()).toContain('not enough values');
  });
});
