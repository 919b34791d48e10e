import { Component, signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { runChecks } from '@shared/recipe-checks';
import type { RecipeContext } from '@shared/recipe-context';
import { computeRecipe, type RecipeComputed } from '@shared/recipe-computations';
import type { RecipeContent } from '@shared/schemas/recipe';
import type { CheckResult } from '@shared/recipe-checks';
import { aLabLimits, aMachine, aMaterial, aRecipeVersion, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { RecipeLivePanel } from './recipe-live-panel';

@Component({
  imports: [RecipeLivePanel],
  template: `<kb-recipe-live-panel [computed]="computed()" [checks]="checks()" />`,
})
class Host {
  readonly computed = signal<RecipeComputed | null>(null);
  readonly checks = signal<readonly CheckResult[]>([]);
}

/** The fixture recipe: Ø10–40 bar, 3000 rpm, on the 250 mm bonded wheel (80 m/s, 1.5 mm) and the bench saw (80 mm flanges, top speed 3500 rpm). */
function content(over: { scope?: Partial<RecipeContent['scope']>; cutting?: Partial<RecipeContent['cutting']> } = {}): RecipeContent {
  const c = aRecipeVersion().content;
  return { ...c, scope: { ...c.scope, ...over.scope }, cutting: { ...c.cutting, ...over.cutting } };
}

function context(over: Partial<RecipeContext> = {}): RecipeContext {
  return { material: aMaterial(), wheel: aWheel(), machine: aMachine(), limits: aLabLimits(), selectionRows: [], ...over };
}

describe('RecipeLivePanel: capacity, worn wheel and kerf', () => {
  let fixture: ComponentFixture<Host>;
  let root: HTMLElement;

  async function show(c: RecipeContent, ctx: RecipeContext): Promise<void> {
    fixture = TestBed.createComponent(Host);
    const computed = computeRecipe(c, ctx);
    fixture.componentInstance.computed.set(computed);
    fixture.componentInstance.checks.set(runChecks(c, ctx, computed));
    await fixture.whenStable();
    root = fixture.nativeElement;
  }

  const text = (selector: string) => (root.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();

  it('says which limit sets the capacity, with the smallest wheel that still cuts the scope (computed by hand)', async () => {
    await show(content(), context());
    const capacity = text('[data-testid="capacity"] dd');
    expect(capacity).toContain('Parts up to 80.0 mm (cutting depth 80.0 mm)'); // (250 − 80)/2 − 5
    expect(capacity).toContain('The scope fits, 40.0 mm to spare');
    expect(text('[data-testid="capacity-limit"] summary')).toBe('Limit: Wheel radius beyond the flange');
    expect(capacity).toContain('The smallest wheel that cuts the scope here: 170 mm'); // 2·(40 + 5) + 80
  });

  it('a wide block under a wheel coming down is judged by its corners: 350 mm wheel, 100 mm flanges, 200 mm wide → 88.6 mm', async () => {
    const ctx = context({
      wheel: aWheel({ diameterMm: 350, thicknessMm: 2.5 }),
      machine: aMachine({ wheelDiameterMaxMm: 350, flangeDiameterMm: 100 }),
    });
    await show(content({ scope: { shape: 'rectangular', sizeMaxMm: 120, widthMm: 200 }, cutting: { wheelRpm: 2800 } }), ctx);
    const capacity = text('[data-testid="capacity"] dd');
    // √(175² − 100²) − 50 − 5 = 88.6 mm; 120 − 88.6 = 31.4 mm; 2·√((120 + 50 + 5)² + 100²) = 403.1, rounded up.
    expect(capacity).toContain('Sections this wide up to 88.6 mm high (a thin one: 120 mm)');
    expect(capacity).toContain('The scope is 31.4 mm too large');
    expect(capacity).toContain('404 mm');
    expect(text('[data-testid="capacity-limit"] summary')).toBe("Limit: Wheel's edge at the corners of the section");
    expect(root.querySelector('[data-testid="capacity"]')!.classList).toContain('kb-over');
    expect(text('[data-check="scope-exceeds-capacity"]')).toContain('88.6 mm');
  });

  it('shows the worn wheel: diameter and its source, capacity and speed when worn, the rpm to hold the new speed capped by the machine', async () => {
    await show(content(), context());
    expect(text('[data-testid="worn-diameter"] dd')).toBe("175 mm 70 % of the new diameter: the lab's default, Kerfbook's starting value (common practice)");
    // (175 − 80)/2 − 5 = 42.5 mm, 2.5 mm more than the Ø40 bar.
    expect(text('[data-testid="worn-capacity"] dd')).toBe('Up to 42.5 mm (cutting depth 42.5 mm) check_circle The scope still fits, 2.50 mm to spare');
    // π·175·3000/60 000 = 27.49 m/s.
    expect(text('[data-testid="worn-speed"] dd')).toBe('27.5 m/s (5411 ft/min)');
    // 3000 × 250/175 = 4285.7 rpm; the marking allows 60 000·80/(π·175) = 8730 rpm, the saw 3500 rpm: π·175·3500/60 000 = 32.07 m/s.
    const rpm = text('[data-testid="worn-rpm"] dd');
    expect(rpm).toContain("4286 rpm would hold it; capped at 3500 rpm by the machine's top speed, giving 32.1 m/s (6313 ft/min)");
    expect(rpm).toContain('OSHA 29 CFR 1910.215(d)(1)');
    // 1.5 mm wheel + 0.2 mm allowance.
    expect(text('[data-testid="kerf"] dd')).toContain("1.70 mm wheel 1.50 mm + 0.20 mm (the lab's allowance, Kerfbook's default)");
  });

  it("warns in words when the scope fits only a wheel that is not yet worn, and uses the wheel's own smallest diameter", async () => {
    await show(content({ scope: { sizeMaxMm: 45 } }), context({ wheel: aWheel({ minUsableDiameterMm: 160 }) }));
    expect(text('[data-testid="worn-diameter"] dd')).toBe("160 mm the wheel's record");
    // (160 − 80)/2 − 5 = 35 mm: 10 mm short of the Ø45 bar.
    expect(text('[data-testid="worn-capacity"] dd')).toContain('warning Fits only a wheel that is not yet worn: 10.0 mm short');
    expect(text('[data-check="scope-exceeds-worn-capacity"]')).toContain('Replace the wheel before it wears below 180 mm');
  });

  it('a rim wheel has no worn diameter and says why; a turned tube is judged by its wall', async () => {
    const ctx = context({
      wheel: aWheel({ kind: 'rim', specification: 'D126N100M', diameterMm: 250, thicknessMm: 0.8 }),
      machine: aMachine({ cutMotions: ['turning-specimen'] }),
    });
    await show(content({ scope: { shape: 'tube', sizeMinMm: 150, sizeMaxMm: 200, wallMm: 5 }, cutting: { cutMotion: 'turning-specimen' } }), ctx);
    expect(text('[data-testid="worn-diameter"] dd')).toContain('None: capacity and speed stay those of the new wheel');
    expect(text('[data-testid="worn-diameter"] dd')).toContain('keeps its diameter');
    expect(root.querySelector('[data-testid="worn-rpm"]')).toBeNull();
    // A 200 mm tube with a 5 mm wall: only the wall counts, (250 − 80)/2 − 5 = 80 mm.
    expect(text('[data-testid="capacity"] dd')).toContain('Turned tubes with walls up to 80.0 mm, whatever the outside diameter');
    expect(text('[data-testid="capacity"] dd')).toContain('The wall fits, 75.0 mm to spare');
    // The plot says its length is a removal length per turn, not a contact arc.
    expect(text('kb-cut-profile-plot figcaption')).toContain('Effective removal length per turn (mm, left)');
    expect(text('[data-testid="length-note"]')).toContain('not a contact arc');
  });
});
