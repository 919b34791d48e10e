import { TestBed } from '@angular/core/testing';
import type { RecipeComparison } from '@shared/recipe-types';
import { type ComparisonLayout, ComparisonView } from './comparison-view';

describe('ComparisonView', () => {
  const comparison: RecipeComparison = {
    recipeId: 3,
    number: 'KB-0003',
    from: { version: 1, status: 'approved', title: 'Tempered bar, transverse' },
    to: { version: 2, status: 'draft', title: 'Tempered bar, transverse' },
    parameters: [
      { path: 'cutting.feedMmS', label: 'Feed rate', before: '0.30 mm/s', after: '0.20 mm/s' },
      { path: 'cutting.wheelId', label: 'Wheel', before: 'Alumina 250 general steel', after: 'Alumina 250 hard steel' },
    ],
    texts: [
      {
        path: 'instructions',
        label: 'Instructions',
        parts: [
          { value: 'Clamp the bar ' },
          { value: 'loosely', removed: true },
          { value: 'firmly', added: true },
          { value: ' and cut ' },
          { value: 'slowly through the core', added: true },
          { value: '.' },
        ],
      },
    ],
  };

  async function render(value: RecipeComparison, layout?: ComparisonLayout): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(ComparisonView);
    fixture.componentRef.setInput('comparison', value);
    if (layout) fixture.componentRef.setInput('layout', layout);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  /** The text a reader sees, without the screen-reader-only words. */
  function visibleText(element: Element): string {
    const copy = element.cloneNode(true) as Element;
    copy.querySelectorAll('.kb-visually-hidden').forEach((hidden) => hidden.remove());
    return copy.textContent ?? '';
  }

  it('lists each changed parameter with its old and new value, units as the server wrote them', async () => {
    const root = await render(comparison);
    const headers = Array.from(root.querySelectorAll('table.kb-params thead th')).map((th) => th.textContent?.trim());
    expect(headers).toEqual(['Parameter', 'Version 1 (Approved)', 'becomes', 'Version 2 (Draft)']);
    const rows = Array.from(root.querySelectorAll('table.kb-params tbody tr')).map((tr) => Array.from(tr.children).map((cell) => cell.textContent?.trim()));
    expect(rows).toEqual([
      ['Feed rate', '0.30 mm/s', '→', '0.20 mm/s'],
      ['Wheel', 'Alumina 250 general steel', '→', 'Alumina 250 hard steel'],
    ]);
    expect(root.textContent).not.toContain('No differences');
  });

  it('side by side: the old text marks removed words, the new text marks added words, each announced', async () => {
    const root = await render(comparison);
    const oldText = root.querySelector('[data-testid="old-text"]')!;
    const newText = root.querySelector('[data-testid="new-text"]')!;

    expect(visibleText(oldText)).toBe('Clamp the bar loosely and cut .');
    expect(Array.from(oldText.querySelectorAll('del')).map(visibleText)).toEqual(['loosely']);
    expect(oldText.querySelector('ins')).toBeNull();
    expect(oldText.querySelector('del')!.textContent).toBe('[removed: loosely]');

    expect(visibleText(newText)).toBe('Clamp the bar firmly and cut slowly through the core.');
    expect(Array.from(newText.querySelectorAll('ins')).map(visibleText)).toEqual(['firmly', 'slowly through the core']);
    expect(newText.querySelector('del')).toBeNull();
    expect(newText.querySelector('ins')!.textContent).toBe('[added: firmly]');

    expect(root.querySelector('[data-testid="inline-text"]')).toBeNull();
    expect(root.textContent).toContain('5 words added, 1 removed');
  });

  it('inline: one flow with both removed and added words in order', async () => {
    const root = await render(comparison, 'inline');
    expect(root.querySelector('[data-testid="old-text"]')).toBeNull();
    const flow = root.querySelector('[data-testid="inline-text"]')!;
    expect(visibleText(flow)).toBe('Clamp the bar looselyfirmly and cut slowly through the core.');
    const marks = Array.from(flow.querySelectorAll('del, ins')).map((el) => `${el.tagName.toLowerCase()}:${visibleText(el)}`);
    expect(marks).toEqual(['del:loosely', 'ins:firmly', 'ins:slowly through the core']);
  });

  it('says there are no differences when nothing changed', async () => {
    const root = await render({ ...comparison, parameters: [], texts: [] });
    expect(root.querySelector('[role="status"]')?.textContent).toContain('No differences');
    expect(root.querySelector('table')).toBeNull();
  });

  it('says a side is empty instead of showing a blank box', async () => {
    const root = await render({
      ...comparison,
      parameters: [],
      texts: [{ path: 'changeReason', label: 'Change reason', parts: [{ value: 'Feed lowered', added: true }] }],
    });
    expect(root.querySelector('[data-testid="old-text"]')?.textContent).toBe('empty');
    expect(visibleText(root.querySelector('[data-testid="new-text"] ins')!)).toBe('Feed lowered');
  });

  it('shows an emptied value as "none" rather than a blank cell', async () => {
    const root = await render({
      ...comparison,
      parameters: [{ path: 'cutting.coolantNote', label: 'Coolant note', before: 'Check the mix daily', after: '' }],
      texts: [],
    });
    const cells = Array.from(root.querySelectorAll('tbody td')).map((td) => td.textContent?.trim());
    expect(cells).toEqual(['Check the mix daily', '→', 'none']);
  });
});
