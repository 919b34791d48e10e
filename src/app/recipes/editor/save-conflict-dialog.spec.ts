import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { NO_MOTION_SETTINGS, type RecipeContent } from '@shared/schemas/recipe';
import { type DraftBody, SaveConflictDialog, differences, merge } from './save-conflict-dialog';
import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

const content = (over: { rpm?: number; hardness?: RecipeContent['scope']['hardness']; instructions?: string } = {}) =>
  ({
    scope: {
      materialId: null,
      group: 'cast-iron',
      hardness: over.hardness ?? null,
      shape: 'round-bar',
      sizeMinMm: 10,
      sizeMaxMm: 40,
      widthMm: null,
      wallMm: null,
      orientation: 'transverse',
      orientationNote: '',
    },
    cutting: {
      machineId: 1,
      wheelId: 2,
      wheelRpm: over.rpm ?? 3000,
      feedMmS: 0.5,
      entryFeedMmS: null,
      entryLengthMm: null,
      cutMotion: 'straight-plunge',
      passes: null,
      ...NO_MOTION_SETTINGS,
    },
    clamping: { method: 'v-block', placement: '', bothSides: true, softInserts: false, supportBlocks: false, orientationRule: '', wheelPath: null },
    coolant: { type: 'water-soluble', concentrationPct: 4, flowLMin: null },
    instructionsMd: over.instructions ?? 'Clamp.',
    acceptanceMd: '',
    cautionsMd: '',
    changeReason: '',
  }) as RecipeContent;

describe('save conflict', () => {
  it('lists changed leaves, and a hardness window added on one side as one field', () => {
    const mine: DraftBody = { title: 'A', content: content({ rpm: 2800, hardness: { min: 180, max: 220, scale: 'HBW' } }) };
    const theirs: DraftBody = { title: 'B', content: content({ instructions: 'Clamp firmly.' }) };
    expect(differences(mine, theirs).map((d) => d.path)).toEqual(['title', 'content.scope.hardness', 'content.cutting.wheelRpm', 'content.instructionsMd']);
    expect(differences(mine, structuredClone(mine))).toEqual([]);
  });

  it('merges: theirs everywhere except where mine was kept', () => {
    const mine: DraftBody = { title: 'A', content: content({ rpm: 2800 }) };
    const theirs: DraftBody = { title: 'B', content: content({ instructions: 'Clamp firmly.' }) };
    const keep = differences(mine, theirs).filter((d) => d.path === 'content.cutting.wheelRpm');
    const merged = merge(mine, theirs, keep);
    expect(merged.title).toBe('B');
    expect(merged.content.cutting.wheelRpm).toBe(2800);
    expect(merged.content.instructionsMd).toBe('Clamp firmly.');
    expect(theirs.content.cutting.wheelRpm).toBe(3000); // inputs untouched
  });

  describe('dialog', () => {
    let fixture: ComponentFixture<SaveConflictDialog>;
    let close: ReturnType<typeof vi.fn>;

    beforeEach(async () => {
      close = vi.fn();
      const theirs = {
        title: 'B',
        content: content({ instructions: 'Clamp firmly.' }),
        revision: 9,
        updatedBy: { id: 2, name: 'Ines' },
        updatedAt: '2026-11-03T11:04:00.000Z',
      } as RecipeVersionDto;
      TestBed.configureTestingModule({
        imports: [SaveConflictDialog],
        providers: [
          provideHttpClient(),
          provideHttpClientTesting(),
          provideLabDateFormat(),
          { provide: MatDialogRef, useValue: { close } },
          {
            provide: MAT_DIALOG_DATA,
            useValue: {
              base: { title: 'A', content: content() },
              mine: { title: 'A', content: content({ rpm: 2800 }) },
              theirs,
              describe: (_p: string, v: unknown) => String(v),
            },
          },
        ],
      });
      fixture = TestBed.createComponent(SaveConflictDialog);
      await fixture.whenStable();
    });

    function button(label: string): HTMLButtonElement {
      return [...(fixture.nativeElement as HTMLElement).querySelectorAll('button')].find((b) => b.textContent?.includes(label))!;
    }

    it('starts each field on the side that changed it', async () => {
      // I changed the rpm; they changed the title and the instructions.
      expect(fixture.nativeElement.textContent).toContain('1 of 3 kept as mine');
      button('Save with these choices').click();
      const merged = close.mock.calls[0][0] as DraftBody;
      expect(merged.title).toBe('B');
      expect(merged.content.cutting.wheelRpm).toBe(2800);
      expect(merged.content.instructionsMd).toBe('Clamp firmly.');
    });

    it('keeps all mine with the shortcut', async () => {
      button('Keep all mine').click();
      await fixture.whenStable();
      button('Save with these choices').click();
      const merged = close.mock.calls[0][0] as DraftBody;
      expect(merged.title).toBe('A');
      expect(merged.content.instructionsMd).toBe('Clamp.');
    });

    it('takes all theirs with the shortcut', async () => {
      button('Take all theirs').click();
      await fixture.whenStable();
      expect(fixture.nativeElement.textContent).toContain('0 of 3 kept as mine');
      button('Save with these choices').click();
      const merged = close.mock.calls[0][0] as DraftBody;
      expect(merged.title).toBe('B');
      expect(merged.content.cutting.wheelRpm).toBe(3000);
    });
  });
});
