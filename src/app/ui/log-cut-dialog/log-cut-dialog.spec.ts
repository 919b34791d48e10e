import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import type { CutRecordDto } from '@shared/recipe-types';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { LogCutDialog, type LogCutDialogData } from './log-cut-dialog';

describe('LogCutDialog', () => {
  let fixture: ComponentFixture<LogCutDialog>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let dialogRef: { close: ReturnType<typeof vi.fn> };
  let notifier: { show: ReturnType<typeof vi.fn> };

  const data: LogCutDialogData = { recipeId: 3, number: 'KB-0003', title: 'Tempered bar, transverse', version: 2 };
  const saved: CutRecordDto = {
    id: 90,
    recipeId: 3,
    number: 'KB-0003',
    version: 2,
    specimenId: 'SP-2026-201',
    partRef: 'Lot 7781',
    quantity: 3,
    outcome: 'burnt',
    notes: 'Dark band near the exit side.',
    operatorId: 12,
    operatorName: 'Kofi Mensah',
    cutAt: '2026-12-01T10:00:00.000Z',
    flagClearedAt: null,
  };

  beforeEach(async () => {
    dialogRef = { close: vi.fn() };
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [LogCutDialog],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: dialogRef },
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(LogCutDialog);
    root = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  function type(name: string, value: string): void {
    const el = root.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[formcontrolname="${name}"]`)!;
    el.value = value;
    el.dispatchEvent(new Event('input'));
  }

  async function choose(outcome: string): Promise<void> {
    root.querySelector<HTMLInputElement>(`[data-outcome="${outcome}"] input[type="radio"]`)!.click();
    await fixture.whenStable();
  }

  async function save(): Promise<void> {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  async function settled(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  function text(testId: string): string {
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  it('offers every outcome with its label and says which version the cut goes against', () => {
    const labels = Array.from(root.querySelectorAll('.kb-outcome-label')).map((l) =>
      l.textContent!.replace(l.querySelector('mat-icon')!.textContent!, '').trim(),
    );
    expect(labels).toEqual(['Good', 'Discoloured or burnt', 'Deformed or burr', 'Wheel broke or glazed', 'Other']);
    expect(root.textContent).toContain('KB-0003 version 2');
  });

  it('posts the cut and closes with the saved record; a flagged outcome says the author will be told', async () => {
    type('specimenId', ' SP-2026-201 ');
    type('partRef', 'Lot 7781');
    type('quantity', '3');
    await choose('burnt');
    expect(text('flag-note')).toBe("flag This cut will be flagged, and the recipe's author will be told.");
    type('notes', 'Dark band near the exit side.');
    await save();

    const req = backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/2/cuts' });
    expect(req.request.body).toEqual({ specimenId: 'SP-2026-201', partRef: 'Lot 7781', quantity: 3, outcome: 'burnt', notes: 'Dark band near the exit side.' });
    req.flush(saved, { status: 201, statusText: 'Created' });
    await settled();
    expect(dialogRef.close).toHaveBeenCalledWith(saved);
  });

  it('asks for notes when the cut was not good, and for an outcome, before sending anything', async () => {
    type('specimenId', 'SP-1');
    await save();
    expect(text('outcome-error')).toBe('Choose the outcome of the cut.');
    await choose('wheel-failure');
    await save();
    await fixture.whenStable();
    expect(text('notes-error')).toBe('Say what you saw: notes are needed when the cut was not good.');
    backend.expectNone('/api/recipes/3/versions/2/cuts');
    await choose('good');
    expect(root.querySelector('[data-testid="flag-note"]')).toBeNull();
  });

  it("puts the server's field errors beside their fields and keeps the dialog open", async () => {
    type('specimenId', 'SP-1');
    await choose('good');
    await save();
    backend.expectOne('/api/recipes/3/versions/2/cuts').flush(
      {
        code: 'VALIDATION_FAILED',
        errors: [
          { path: 'specimenId', message: 'Specimen id is already used today.' },
          { path: 'quantity', message: 'At most 1000.' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settled();
    expect(text('specimenId-error')).toBe('Specimen id is already used today.');
    expect(text('quantity-error')).toBe('At most 1000.');
    expect(dialogRef.close).not.toHaveBeenCalled();
    expect(notifier.show).not.toHaveBeenCalled();
  });

  it('says so when the version is no longer the current one', async () => {
    type('specimenId', 'SP-1');
    await choose('good');
    await save();
    backend
      .expectOne('/api/recipes/3/versions/2/cuts')
      .flush({ code: 'CONFLICT', errors: [{ path: '', message: 'Only the current version takes cuts.' }] }, { status: 409, statusText: 'Conflict' });
    await settled();
    expect(text('form-error')).toBe('Only the current version takes cuts. Open the recipe again to see which version is current now.');
    expect(dialogRef.close).not.toHaveBeenCalled();
  });

  it('says why an unacknowledged version takes no cut and links to acknowledging it', async () => {
    type('specimenId', 'SP-1');
    await choose('good');
    await save();
    backend.expectOne('/api/recipes/3/versions/2/cuts').flush(
      {
        code: 'ACKNOWLEDGE_FIRST',
        errors: [{ path: '', message: 'Acknowledge version 2 of KB-0003 (read and understood) before you log a cut with it.' }],
      },
      { status: 409, statusText: 'Conflict' },
    );
    await settled();
    expect(text('acknowledge-first')).toContain('Acknowledge version 2 of KB-0003 (read and understood) before you log a cut with it.');
    const link = root.querySelector<HTMLAnchorElement>('[data-testid="acknowledge-first"] a')!;
    expect(link.getAttribute('href')).toBe('/recipes/3/acknowledge?v=2');
    expect(link.textContent).toContain('Read and acknowledge version 2');
    expect(root.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    expect(text('form-error')).toBe('');
    expect(dialogRef.close).not.toHaveBeenCalled();
  });
});

describe('LogCutDialog for a version still to acknowledge', () => {
  it('says so before anything is typed and offers no save', async () => {
    TestBed.configureTestingModule({
      imports: [LogCutDialog],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: { close: vi.fn() } },
        { provide: MAT_DIALOG_DATA, useValue: { recipeId: 3, number: 'KB-0003', title: 'Tempered bar', version: 2, mustAcknowledge: true } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    const fixture = TestBed.createComponent(LogCutDialog);
    await fixture.whenStable();
    const root: HTMLElement = fixture.nativeElement;
    const notice = root.querySelector('[data-testid="acknowledge-first"]')!;
    expect(notice.textContent).toContain('You have not acknowledged version 2 of KB-0003 yet');
    expect(notice.querySelector('a')!.getAttribute('href')).toBe('/recipes/3/acknowledge?v=2');
    expect(root.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    TestBed.inject(HttpTestingController).verify();
  });
});
