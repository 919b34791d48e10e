import { Component, signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { computeRecipe, type RecipeComputed } from '@shared/recipe-computations';
import { aLabLimits, aMachine, aMaterial, aRecipeVersion, aWheel } from '../../../testing/stock-and-recipe-fixtures';
import { RecipeLivePanel } from './recipe-live-panel';

@Component({
  imports: [RecipeLivePanel],
  template: `<kb-recipe-live-panel [computed]="computed()" [checks]="[]" />`,
})
class Host {
  readonly computed = signal<RecipeComputed | null>(null);
}

/**
 * The fixture recipe: a Ø40 steel bar, 250 × 1.5 mm wheel at 3000 rpm, 0.5 mm/s. Computed by
 * hand: Q = 0.5 × 1.5 × 40 = 30 mm³/s; at 30 J/mm³ P = 900 W (P = Q·u, Malkin & Guo);
 * v_s = π·250·3000/60 000 = 39.27 m/s, F_t = 900 / 39.27 = 22.9 N; Q'_w = 30 / 1.5 = 20 mm²/s,
 * h_eq = 20 / 39.27 = 0.509 µm.
 */
function computedFor(motorPowerKw: number | null, powerWarningPct = 80, specificEnergy: number | null = 30): RecipeComputed {
  return computeRecipe(aRecipeVersion().content, {
    material: aMaterial(),
    wheel: aWheel(),
    machine: aMachine({ motorPowerKw }),
    limits: aLabLimits({ specificEnergyJMm3: specificEnergy === null ? {} : { 'plain-low-alloy-steel': specificEnergy }, powerWarningPct }),
    selectionRows: [],
  });
}

describe('RecipeLivePanel: cutting power and heat', () => {
  let fixture: ComponentFixture<Host>;
  let root: HTMLElement;

  async function show(computed: RecipeComputed): Promise<void> {
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.computed.set(computed);
    await fixture.whenStable();
    root = fixture.nativeElement;
  }

  const figure = (id: string) => root.querySelector(`[data-testid="${id}"]`)!.textContent!.replace(/\s+/g, ' ');

  it('shows peak power with its share of the motor, the tangential force, h_eq and the specific energy, in their own block with the power plot', async () => {
    await show(computedFor(2.2));
    const block = root.querySelector('[data-testid="power-block"]')!;
    expect(block.querySelector('h3')!.textContent).toBe('Cutting power and heat');
    // 900 W of 2200 W = 40.9 %.
    expect(figure('peak-power')).toContain('Peak cutting power 900 W');
    expect(figure('peak-power')).toContain('41 % of the 2.20 kW motor (the lab warns above 80 %)');
    expect(root.querySelector('[data-testid="peak-power"] mat-icon')!.textContent).toBe('check_circle');
    expect(figure('tangential-force')).toContain('22.9 N');
    expect(figure('chip-thickness')).toContain('0.509 µm');
    expect(figure('specific-energy')).toContain('30 J/mm³');
    expect(figure('specific-energy')).toContain('order of magnitude');
    expect(block.querySelector('kb-cut-power-plot path[data-series="power"]')).not.toBeNull();
    // The removal plot is still there, beside the power plot.
    expect(root.querySelector('kb-cut-profile-plot path[data-series="removal"]')).not.toBeNull();
  });

  it('says in words and with an icon when the peak is above the lab share (900 W of 1.1 kW = 82 %)', async () => {
    await show(computedFor(1.1));
    expect(figure('peak-power')).toContain("82 % of the 1.10 kW motor: above the lab's 80 %");
    expect(root.querySelector('[data-testid="peak-power"]')!.classList).toContain('kb-over');
    expect(root.querySelector('[data-testid="peak-power"] mat-icon')!.textContent).toBe('warning');
  });

  it('says when the motor power is not recorded, and when the group has no specific energy', async () => {
    await show(computedFor(null));
    expect(figure('peak-power')).toContain("The machine's motor power is not recorded");
    await show(computedFor(2.2, 80, null));
    expect(figure('peak-power')).toContain('The lab has no specific cutting energy for this material group');
    expect(figure('chip-thickness')).toContain('0.509 µm');
    expect(root.querySelector('kb-cut-power-plot')).toBeNull();
  });
});
