import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { LabSettingsDto } from '@shared/schemas/lab-settings';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { LabSettings } from './lab-settings';

const settings: LabSettingsDto = {
  labName: 'Our lab',
  sheetPaper: 'A4',
  reviewIntervalMonths: 24,
  defaultUnits: 'metric',
  dateFormat: 'iso',
  sealIntervalHours: 24,
  feedCeilings: [
    { group: 'copper', hardness: null, machineClass: 'precision', maxFeedMmS: 0.5 },
    { group: 'titanium', hardness: { min: 300, max: 400, scale: 'HV' }, machineClass: 'bench-abrasive', maxFeedMmS: 1.2 },
  ],
  traverseRemovalCeilings: { copper: 40 },
  longContactMm: 60,
  wornDiameterShare: 0.7,
  kerfAllowanceMm: 0.2,
  specificEnergyJMm3: { copper: 20 },
  powerWarningPct: 80,
  revision: 3,
  updatedAt: '2026-12-05T14:05:00.000Z',
};

describe('LabSettings', () => {
  let fixture: ComponentFixture<LabSettings>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let notifier: { show: ReturnType<typeof vi.fn> };

  /** Answers every GET of the settings (the screen's own and the date format's). */
  function answerGets(dto: LabSettingsDto): void {
    for (const req of backend.match({ method: 'GET', url: '/api/settings/lab' })) req.flush(dto);
  }

  async function settle(): Promise<void> {
    await fixture.whenStable();
    fixture.detectChanges();
  }

  function input(label: string): HTMLInputElement {
    const el =
      root.querySelector<HTMLInputElement>(`input[aria-label="${label}"]`) ??
      [...root.querySelectorAll('mat-form-field')].find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)?.querySelector('input');
    if (!el) throw new Error(`no field ${label}`);
    return el;
  }

  function type(label: string, value: string): void {
    const el = input(label);
    el.value = value;
    el.dispatchEvent(new Event('input'));
  }

  async function save(): Promise<void> {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await settle();
  }

  beforeEach(async () => {
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [LabSettings],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Notifier, useValue: notifier },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(LabSettings);
    root = fixture.nativeElement;
    await settle();
    answerGets(settings);
    await settle();
    answerGets(settings);
    await settle();
  });

  afterEach(() => backend.verify());

  it('shows the stored values, the feed ceilings with their bands, and when they last changed in the lab format', () => {
    expect(input('Lab name').value).toBe('Our lab');
    expect(input('Periodic review interval (months)').value).toBe('24');
    expect(input('Specific cutting energy, Copper alloys').value).toBe('20');
    expect(input('Specific cutting energy, Titanium alloys').value).toBe('');
    const rows = [...root.querySelectorAll('table')[1]!.querySelectorAll('tbody tr')].map((r) => r.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('any hardness');
    expect(rows[1]).toContain('300–400 HV');
    expect(root.textContent).toContain('Revision 3, last changed 2026-12-05 14:05 UTC');
  });

  it('refuses a bad value with the schema message and sends nothing', async () => {
    type('Periodic review interval (months)', '0');
    type('Trail seal interval (hours)', '721');
    type('Highest feed, Copper alloys, any hardness, Precision', '-1');
    await save();
    backend.expectNone({ method: 'PUT' });
    expect(root.textContent).toContain('Review interval must be at least 1 month.');
    expect(root.textContent).toContain('Seal interval must be at most 720 hours (30 days).');
    expect(root.textContent).toContain('Feed ceiling must be more than 0 mm/s.');
    expect(root.textContent).toContain('Nothing was saved');
  });

  it('saves every value with the revision it opened, leaves out empty groups, and shows dates in the saved format', async () => {
    type('Worn wheel: share of the new diameter', '0.75');
    type('Trail seal interval (hours)', '6');
    type('Specific cutting energy, Copper alloys', '');
    await save();
    const req = backend.expectOne({ method: 'PUT', url: '/api/settings/lab' });
    expect(req.request.body).toMatchObject({
      wornDiameterShare: 0.75,
      sealIntervalHours: 6,
      revision: 3,
      specificEnergyJMm3: {},
      traverseRemovalCeilings: { copper: 40 },
    });
    expect(req.request.body.feedCeilings).toHaveLength(2);
    req.flush({ ...settings, wornDiameterShare: 0.75, specificEnergyJMm3: {}, dateFormat: 'dmy-dot', revision: 4 });
    await settle();
    expect(notifier.show).toHaveBeenCalledWith('The lab settings have been saved.', 'OK', 4000);
    expect(root.textContent).toContain('Revision 4, last changed 05.12.2026 14:05 UTC');
  });

  it('adds no feed ceiling while a number in the new row cannot be read, and says why under the field', async () => {
    type('Hardness from', '1.000,5');
    type('Highest feed (mm/s)', '0,4');
    [...root.querySelectorAll('button')].find((b) => b.textContent?.trim().endsWith('Add'))!.click();
    await settle();
    expect(root.querySelectorAll('table')[1]!.querySelectorAll('tbody tr')).toHaveLength(2);
    expect(root.textContent).toContain('Nothing was added: correct the values marked in red.');
    expect(root.textContent).toContain('"1.000,5" has more than one point or comma');
  });

  it('after a save that came too late, says so and offers the current settings', async () => {
    type('Lab name', 'Late lab');
    await save();
    const current = { ...settings, labName: 'Changed meanwhile', revision: 4 };
    backend
      .expectOne({ method: 'PUT', url: '/api/settings/lab' })
      .flush(
        { code: 'CONFLICT', errors: [{ path: 'revision', message: 'The lab settings were changed after you opened them.' }], current },
        { status: 409, statusText: 'Conflict' },
      );
    await settle();
    expect(root.textContent).toContain('The lab settings were changed after you opened them.');
    [...root.querySelectorAll('button')].find((b) => b.textContent?.includes('Show the current settings'))!.click();
    await settle();
    expect(input('Lab name').value).toBe('Changed meanwhile');
    expect(root.textContent).toContain('Revision 4');
  });
});
