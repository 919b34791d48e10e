import { Component, signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import type { ContactPoint } from '@shared/contact-length';
import type { ContactMeasure } from '@shared/vocabulary';
import { CutProfilePlot, niceTicks } from './cut-profile-plot';

@Component({
  imports: [CutProfilePlot],
  template: `<kb-cut-profile-plot [points]="points()" [measure]="measure()" />`,
})
class Host {
  readonly points = signal<readonly ContactPoint[]>([]);
  readonly measure = signal<ContactMeasure>('contact-length');
}

/** A 40 mm round bar, 1.5 mm wheel at 0.2 mm/s: chord 2·√(x·(40 − x)), peak 40 mm at 20 mm deep. */
function roundBar(): ContactPoint[] {
  return [0, 10, 20, 30, 40].map((x) => {
    const contactMm = 2 * Math.sqrt(x * (40 - x));
    return { depthMm: x, contactMm, removalMm3S: 0.2 * 1.5 * contactMm };
  });
}

describe('CutProfilePlot', () => {
  let fixture: ComponentFixture<Host>;
  let root: HTMLElement;

  async function plot(points: readonly ContactPoint[]): Promise<void> {
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.points.set(points);
    await fixture.whenStable();
    root = fixture.nativeElement;
  }

  function series(name: string): string {
    return root.querySelector(`path[data-series="${name}"]`)?.getAttribute('d') ?? '';
  }

  it('draws one path per series through every point', async () => {
    await plot(roundBar());
    for (const name of ['contact', 'removal']) {
      const d = series(name);
      expect(d.startsWith('M')).toBe(true);
      expect(d.match(/[ML]/g)).toHaveLength(5);
    }
    // The contact line starts at the bottom (0 mm at the entry) and rises to the top at the centre.
    const [start, , middle] = series('contact')
      .split(' ')
      .map((s) => s.slice(1).split(',').map(Number));
    expect(middle[1]).toBeLessThan(start[1]);
    expect(middle[0]).toBeGreaterThan(start[0]);
  });

  it('labels the axes with units and has a legend', async () => {
    await plot(roundBar());
    const text = root.textContent ?? '';
    expect(text).toContain('Depth into the cut (mm)');
    expect(text).toContain('mm³/s');
    expect(text).toContain('Contact length (mm, left)');
    expect(root.querySelector('[data-testid="length-note"]')).toBeNull();
    expect(text).toContain('Removal rate (mm³/s, right)');
    // Depth ticks run to the end of the cut.
    expect(text).toContain('40');
  });

  it('summarises the peaks for screen readers', async () => {
    await plot(roundBar());
    const svg = root.querySelector('svg[role="img"]')!;
    const label = svg.getAttribute('aria-label')!;
    expect(label).toContain('contact length peaks at 40 mm at 20 mm deep');
    expect(label).toContain('removal rate peaks at 12 mm³/s at 20 mm deep');
  });

  it("labels a turning part's length as an effective removal length per turn, not a contact length", async () => {
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.points.set(roundBar());
    fixture.componentInstance.measure.set('removal-length-per-turn');
    await fixture.whenStable();
    root = fixture.nativeElement;
    const text = root.textContent ?? '';
    expect(text).toContain('Effective removal length per turn (mm, left)');
    expect(text).not.toContain('Contact length');
    expect(root.querySelector('[data-testid="length-note"]')!.textContent).toContain('2π·r');
    expect(root.querySelector('svg[role="img"]')!.getAttribute('aria-label')).toContain('effective removal length per turn peaks at 40 mm');
  });

  it('says what is missing instead of drawing an empty plot', async () => {
    await plot([{ depthMm: 0, contactMm: 0, removalMm3S: 0 }]);
    expect(root.querySelector('path[data-series]')).toBeNull();
    expect(root.querySelector('svg')!.getAttribute('aria-label')).toContain('not enough values');
  });

  it('picks round tick steps', () => {
    expect(niceTicks(40)).toEqual([0, 10, 20, 30, 40]);
    expect(niceTicks(12)).toEqual([0, 5, 10, 15]);
    expect(niceTicks(0.9)).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });
});
