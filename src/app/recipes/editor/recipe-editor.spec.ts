import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { UserDto } from '@shared/api-types';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { NO_MOTION_SETTINGS, type SaveDraftBody } from '@shared/schemas/recipe';
import { type LabLimits, type MachineRecord, type MaterialRecord, NO_LAB_LIMITS, type SelectionRow, type WheelRecord } from '@shared/stock-types';
import { aUser } from '../../../testing/user-fixture';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { RecipeEditor } from './recipe-editor';
import { provideLabDateFormat } from '../../../testing/lab-date-format';

// Invented stock: a bench saw that could spin well past the wheel's marked speed, so only the
// wheel's own limit is at stake in the over-speed test. Its spindle is limited to 6000 rpm, within
// the wheel's 6111 rpm, so the machine itself cannot over-speed the wheel.
const MATERIAL: MaterialRecord = {
  id: 5,
  name: 'Quenched Cr-Mo bar',
  designation: 'EN 1.7225',
  group: 'plain-low-alloy-steel',
  condition: 'quenched and tempered',
  hardness: { value: 32, scale: 'HRC' },
  coated: false,
  coatingHardness: null,
  caseHardened: false,
  caseDepthMm: null,
  heatSensitive: false,
  hazardousDust: false,
  combustibleFines: false,
  notes: '',
  archived: false,
  updatedAt: '2026-10-02T09:00:00.000Z',
};
/** A sprayed shaft: the editor asks where the wheel enters and leaves it. */
const COATED: MaterialRecord = {
  ...MATERIAL,
  id: 6,
  name: 'Sprayed Cr-Mo shaft',
  coated: true,
  coatingHardness: { value: 1150, scale: 'HV' },
};
const MACHINE: MachineRecord = {
  id: 1,
  name: 'Bench saw B2',
  machineClass: 'bench-abrasive',
  wheelDiameterMinMm: 200,
  wheelDiameterMaxMm: 300,
  flangeDiameterMm: 80,
  rpmMin: 1000,
  rpmMax: 8000,
  feedMinMmS: 0.05,
  feedMaxMmS: 2,
  feedControl: 'automatic',
  feedDirection: 'wheel-down',
  spindleLimitRpm: 6000,
  spindleLimitSetBy: 'Maintenance, work order 12',
  motorPowerKw: null,
  cutMotions: ['straight-plunge', 'pulsed-plunge'],
  clampingMethods: ['vise-backstop', 'top-clamp'],
  notes: '',
  archived: false,
  updatedAt: '2026-10-02T09:00:00.000Z',
};
/** Ø250 mm, marked 80 m/s: at most 6111 rpm (60 000 · 80 / (π · 250) = 6111.5). */
const WHEEL: WheelRecord = {
  id: 2,
  name: 'Alumina 250',
  kind: 'bonded',
  specification: 'A60K5B',
  diameterMm: 250,
  thicknessMm: 1.5,
  boreMm: 32,
  maxSpeedMarkedIn: 'm/s',
  maxSpeedMs: 80,
  maxSpeedRpm: 6111.55,
  dryAllowed: false,
  restrictions: [],
  minUsableDiameterMm: null,
  notes: '',
  archived: false,
  updatedAt: '2026-10-02T09:00:00.000Z',
};
const ROWS: SelectionRow[] = [{ id: 1, group: 'plain-low-alloy-steel', hardness: null, wheelId: 2, note: '' }];
const LIMITS: LabLimits = {
  ...NO_LAB_LIMITS,
  feedCeilings: [{ group: 'plain-low-alloy-steel', hardness: null, machineClass: 'bench-abrasive', maxFeedMmS: 1 }],
  specificEnergyJMm3: { 'plain-low-alloy-steel': 30 },
};

function aDraft(overrides: Partial<RecipeVersionDto> = {}): RecipeVersionDto {
  return {
    recipeId: 3,
    number: 'KB-0003',
    title: 'Quenched bar, transverse',
    version: 1,
    status: 'draft',
    revision: 4,
    content: {
      scope: {
        materialId: 5,
        group: 'plain-low-alloy-steel',
        hardness: null,
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
        wheelRpm: 3000,
        feedMmS: 0.5,
        entryFeedMmS: null,
        entryLengthMm: null,
        cutMotion: 'straight-plunge',
        passes: null,
        ...NO_MOTION_SETTINGS,
      },
      clamping: {
        method: 'vise-backstop',
        placement: 'Both sides of the cut',
        bothSides: true,
        softInserts: false,
        supportBlocks: false,
        orientationRule: '',
        wheelPath: null,
      },
      coolant: { type: 'water-soluble', concentrationPct: 4, flowLMin: 8 },
      instructionsMd: '1. Clamp the bar.\n2. Start the coolant.',
      acceptanceMd: 'No temper colours on the face.',
      cautionsMd: '',
      changeReason: '',
    },
    contentHash: null,
    checks: [],
    createdBy: { id: 7, name: 'Ragna Lindqvist' },
    updatedBy: { id: 7, name: 'Ragna Lindqvist' },
    createdAt: '2026-11-01T08:00:00.000Z',
    updatedAt: '2026-11-02T08:00:00.000Z',
    attachments: [],
    ...overrides,
  };
}

describe('RecipeEditor', () => {
  /** More wheels and selection rows for one test (reset after each). */
  let extraWheels: WheelRecord[] = [];
  let extraRows: SelectionRow[] = [];
  let fixture: ComponentFixture<RecipeEditor>;
  let backend: HttpTestingController;
  let root: HTMLElement;

  async function open(
    id: string | undefined,
    versions: RecipeVersionDto[],
    user: UserDto = aUser(),
    afterLoad: () => Promise<void> | void = () => undefined,
  ): Promise<void> {
    TestBed.configureTestingModule({
      imports: [RecipeEditor],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Notifier, useValue: { show: vi.fn() } },
        { provide: Session, useValue: { user: signal(user), clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    fixture = TestBed.createComponent(RecipeEditor);
    if (id) fixture.componentRef.setInput('id', id);
    root = fixture.nativeElement;
    await fixture.whenStable();
    const page = (items: unknown[]) => ({ items, total: items.length, page: 0, pageSize: 200 });
    backend.expectOne((r) => r.url === '/api/materials').flush(page([MATERIAL, COATED]));
    backend.expectOne((r) => r.url === '/api/machines').flush(page([MACHINE]));
    backend.expectOne((r) => r.url === '/api/wheels').flush(page([WHEEL, ...extraWheels]));
    backend.expectOne('/api/selection-rows').flush([...ROWS, ...extraRows]);
    backend.expectOne('/api/settings/limits').flush(LIMITS);
    if (id) backend.expectOne(`/api/recipes/${id}/versions`).flush(versions);
    await afterLoad();
    await vi.waitFor(() => expect(root.querySelector('form.kb-form')).not.toBeNull());
    await fixture.whenStable();
    // The review comments of a saved version; none here, so their panel stays hidden.
    if (id) {
      (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: `/api/recipes/${id}/versions/${versions[0]?.version ?? 1}/comments` }))).flush([]);
      await fixture.whenStable();
    }
  }

  afterEach(() => {
    extraWheels = [];
    extraRows = [];
    backend.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((el) => (el.innerHTML = ''));
  });

  function field(id: string): HTMLInputElement {
    const el = root.querySelector<HTMLInputElement>(`#${id}`);
    if (!el) throw new Error(`no field #${id}`);
    return el;
  }

  function type(id: string, value: string): void {
    field(id).value = value;
    field(id).dispatchEvent(new Event('input'));
  }

  function text(selector: string, scope: ParentNode = root): string {
    return scope.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  async function until(assertion: () => void): Promise<void> {
    await vi.waitFor(async () => {
      await fixture.whenStable();
      assertion();
    });
  }

  function clickSave(): void {
    [...root.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Save draft'))!.click();
  }

  it('recomputes the live panel after input and blocks an rpm above the wheel’s marked maximum', async () => {
    await open('3', [aDraft()]);
    // 250 mm at 3000 rpm: v = π · D · n / 60 000 = π · 250 · 3000 / 60 000 = 39.27 m/s (peripheral speed, worked by hand).
    await until(() => expect(text('[data-testid="peripheral-speed"] dd')).toBe('39.3 m/s (7730 ft/min)'));
    expect(text('[data-testid="rpm-at-max"] dd')).toBe('6111 rpm');
    // Marked in m/s, shown as marked with the rpm at the new diameter; the spindle limit is lower.
    expect(text('[data-testid="marked-maximum"]')).toBe('80 m/s (marked) · 6111 rpm at 250 mm');
    expect(text('[data-testid="never-above"] dd')).toBe('Never above 6000 rpm');
    expect(root.querySelector('[data-check="wheel-overspeed"]')).toBeNull();
    expect(text('[data-testid="no-blockers"]')).toContain('No blockers');

    type('f-cutting-wheelRpm', '7000');
    // 250 mm at 7000 rpm = 91.6 m/s, above the marked 80 m/s.
    await until(() => expect(text('[data-testid="peripheral-speed"] dd')).toBe('91.6 m/s (18037 ft/min)'));
    const blocker = root.querySelector('[data-check="wheel-overspeed"]')!;
    expect(blocker.classList).toContain('kb-check-blocker');
    expect(text('.kb-check-severity', blocker)).toBe('Blocker');
    expect(text('.kb-check-message', blocker)).toContain('above its marked maximum of 80.0 m/s');
    expect(text('.kb-check-message', blocker)).toContain('6111 rpm');
    expect(text('.kb-check-reason', blocker)).toContain('EN 12413');
    expect(text('[data-testid="speed-margin"]')).toContain('Over the marked maximum');
    expect(root.querySelector('[data-testid="no-blockers"]')).toBeNull();

    // The check takes the author to the field it is about.
    blocker.querySelector<HTMLButtonElement>('button')!.click();
    expect(document.activeElement?.id).toBe('f-cutting-wheelRpm');

    type('f-cutting-wheelRpm', '3000');
    await until(() => expect(root.querySelector('[data-check="wheel-overspeed"]')).toBeNull());
    expect(text('[data-testid="no-blockers"]')).toContain('No blockers');
  });

  it('shows the wheel the lab’s table suggests and applies it in one click', async () => {
    const draft = aDraft();
    draft.content.cutting.wheelId = 99; // a wheel no longer in stock
    await open('3', [draft], aUser(), async () => {
      const gone = await vi.waitFor(() => backend.expectOne('/api/wheels/99'));
      gone.flush({ code: 'NOT_FOUND', errors: [{ path: '', message: 'Gone.' }] }, { status: 404, statusText: 'Not Found' });
    });
    await until(() => expect(text('[data-testid="wheel-suggestion"]')).toContain('Suggested for this material: Alumina 250'));
    [...root.querySelectorAll<HTMLButtonElement>('[data-testid="wheel-suggestion"] button')].find((b) => b.textContent?.includes('Use Alumina 250'))!.click();
    await until(() => expect(text('[data-testid="wheel-suggestion"]')).toContain('In use'));
  });

  it('offers no "use" button for a suggested wheel the machine does not take, and says why', async () => {
    // Ø400 mm on a saw that takes 200–300 mm wheels.
    extraWheels = [{ ...WHEEL, id: 8, name: 'Alumina 400', diameterMm: 400, maxSpeedRpm: 3819.72 }];
    extraRows = [{ id: 2, group: 'plain-low-alloy-steel', hardness: null, wheelId: 8, note: '' }];
    await open('3', [aDraft()]);
    await until(() => expect(text('[data-testid="wheel-suggestion"]')).toContain('Alumina 400'));
    // Alumina 250 is in use; Alumina 400 does not fit: no button at all.
    const buttons = [...root.querySelectorAll<HTMLButtonElement>('[data-testid="wheel-suggestion"] button')].map((b) => b.textContent?.trim());
    expect(buttons).toEqual([]);
    expect(text('[data-testid="wheel-suggestion"]')).toContain('In use');
    expect(text('[data-testid="wheel-suggestion"]')).toContain('Ø400 mm is outside the wheel sizes Bench saw B2 takes.');
  });

  it('saves with the revision the edit was based on, then with the one the server returned', async () => {
    await open('3', [aDraft({ revision: 4 })]);
    type('f-title', 'Quenched bar, transverse, wet');
    await until(() => expect(text('[data-testid="save-status"]')).toBe('Unsaved changes'));
    clickSave();
    const first = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
    const body = first.request.body as SaveDraftBody;
    expect(body.revision).toBe(4);
    expect(body.title).toBe('Quenched bar, transverse, wet');
    expect(body.content.cutting.wheelRpm).toBe(3000);
    expect(body.content.scope.widthMm).toBeNull();
    first.flush(aDraft({ revision: 5, title: body.title }));
    await until(() => expect(text('[data-testid="save-status"]')).toMatch(/^Saved \d\d:\d\d UTC$/));

    type('f-cutting-feedMmS', '0.3');
    clickSave();
    const second = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
    expect((second.request.body as SaveDraftBody).revision).toBe(5);
    expect((second.request.body as SaveDraftBody).content.cutting.feedMmS).toBe(0.3);
    second.flush(aDraft({ revision: 6 }));
  });

  it('does not send a draft the shared schema refuses', async () => {
    await open('3', [aDraft()]);
    type('f-scope-sizeMaxMm', '5'); // below the smallest size, 10 mm
    clickSave();
    await until(() => expect(text('[data-testid="form-error"]')).toContain('marked'));
    expect(text('mat-error', field('f-scope-sizeMaxMm').closest('mat-form-field')!)).toBe('Largest size must not be below the smallest.');
    backend.expectNone({ method: 'PUT', url: '/api/recipes/3/versions/1' });
  });

  it('on a stale save shows the fields that differ and saves the chosen merge on top of the current revision', async () => {
    await open('3', [aDraft({ revision: 4 })]);
    type('f-cutting-wheelRpm', '2800');
    clickSave();
    const stale = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
    const theirs = aDraft({ revision: 6, updatedBy: { id: 9, name: 'Ines Author' }, updatedAt: '2026-11-03T11:04:00.000Z' });
    theirs.content.cutting.feedMmS = 0.3;
    stale.flush(
      { code: 'CONFLICT', errors: [{ path: 'revision', message: 'Ines Author saved this draft after you opened it.' }], current: theirs },
      { status: 409, statusText: 'Conflict' },
    );
    const dialog = await vi.waitFor(() => {
      const el = document.querySelector<HTMLElement>('kb-save-conflict-dialog');
      expect(el).not.toBeNull();
      return el!;
    });
    // The 409 carries the current version, so the dialog opens without fetching it again.
    backend.expectNone({ method: 'GET', url: '/api/recipes/3/versions/1' });
    await fixture.whenStable();
    expect(text('[data-testid="save-status"]')).toContain('Not saved');
    const rows = [...dialog.querySelectorAll<HTMLElement>('tbody tr')];
    expect(rows.map((r) => r.dataset['path'])).toEqual(['content.cutting.wheelRpm', 'content.cutting.feedMmS']);
    const cells = (row: HTMLElement) => [...row.querySelectorAll('th, td.kb-value')].map((c) => c.textContent!.trim());
    // Field, when opened, theirs, mine.
    expect(cells(rows[0])).toEqual(['Wheel speed', '3000 rpm', '3000 rpm', '2800 rpm']);
    expect(cells(rows[1])).toEqual(['Feed', '0.50 mm/s', '0.30 mm/s', '0.50 mm/s']);

    // Each field starts on the side that changed it: my wheel speed, their feed.
    const checked = (row: HTMLElement) => row.querySelector('mat-radio-button.mat-mdc-radio-checked')?.textContent?.trim();
    expect(checked(rows[0])).toBe('Keep mine');
    expect(checked(rows[1])).toBe('Take theirs');
    [...dialog.querySelectorAll('button')].find((b) => b.textContent?.includes('Save with these choices'))!.click();

    const resave: TestRequest = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
    const body = resave.request.body as SaveDraftBody;
    expect(body.revision).toBe(6);
    expect(body.content.cutting.wheelRpm).toBe(2800);
    expect(body.content.cutting.feedMmS).toBe(0.3);
    resave.flush(aDraft({ revision: 7 }));
    await until(() => expect(text('[data-testid="save-status"]')).toMatch(/^Saved/));
  });

  it('explains that a submitted version cannot be edited and links to the recipe', async () => {
    await open('3', [aDraft({ status: 'approved', contentHash: 'b'.repeat(64) })]);
    expect(text('[data-testid="locked"]')).toContain('Only drafts and versions returned for changes can be edited');
    expect(root.querySelector('[data-testid="locked"] a')!.getAttribute('href')).toBe('/recipes/3');
    expect(field('f-cutting-wheelRpm').disabled).toBe(true);
    expect(root.querySelector('[data-testid="save-status"]')).toBeNull();
  });

  it('asks before leaving with unsaved changes, not when everything is saved', async () => {
    // The server's canonical JSON may order keys differently from the form: still not a change.
    const sortKeys = (v: unknown): unknown =>
      v && typeof v === 'object' && !Array.isArray(v)
        ? Object.fromEntries(
            Object.keys(v)
              .sort()
              .reverse()
              .map((k) => [k, sortKeys((v as Record<string, unknown>)[k])]),
          )
        : v;
    await open('3', [sortKeys(aDraft()) as RecipeVersionDto]);
    expect(text('[data-testid="save-status"]')).toMatch(/^Saved/);
    expect(await fixture.componentInstance.canLeave()).toBe(true);
    type('f-cutting-feedMmS', '0.4');
    await fixture.whenStable();
    const answer = fixture.componentInstance.canLeave();
    const dialog = await vi.waitFor(() => {
      const el = document.querySelector<HTMLElement>('kb-confirm-dialog');
      expect(el?.textContent).toContain('Leave with unsaved changes?');
      return el!;
    });
    [...dialog.querySelectorAll('button')].find((b) => b.textContent?.includes('Cancel'))!.click();
    expect(await answer).toBe(false);
  });

  it('uploads a chosen photo at once; while it is not on the server the version cannot be submitted and leaving asks', async () => {
    await open('3', [aDraft()]);
    const submit = () => [...root.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent?.includes('Submit for review'))!;
    await until(() => expect(submit().disabled).toBe(false));
    const input = root.querySelector<HTMLInputElement>('#kb-photo-file')!;
    Object.defineProperty(input, 'files', { value: [new File([new Uint8Array(512)], 'setup.png', { type: 'image/png' })], configurable: true });
    input.dispatchEvent(new Event('change'));
    // On its way without a second click; meanwhile the editor says so and holds the submit.
    const upload = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes/3/versions/1/attachments' }));
    await until(() => expect(text('[data-testid="photo-pending"]')).toMatch(/setup\.png is still uploading/));
    expect(submit().disabled).toBe(true);
    const answer = fixture.componentInstance.canLeave();
    const dialog = await vi.waitFor(() => {
      const el = document.querySelector<HTMLElement>('kb-confirm-dialog');
      expect(el?.textContent).toContain('Leave without the photo?');
      return el!;
    });
    [...dialog.querySelectorAll('button')].find((b) => b.textContent?.includes('Cancel'))!.click();
    expect(await answer).toBe(false);

    upload.flush({
      id: 9,
      role: 'setup',
      caption: '',
      fileName: 'setup.png',
      mimeType: 'image/png',
      sizeBytes: 512,
      sha256: 'b'.repeat(64),
      width: 64,
      height: 48,
      url: '/a/9',
      thumbnailUrl: '/a/9/t',
    });
    await until(() => expect(root.querySelector('[data-testid="photo-pending"]')).toBeNull());
    expect(submit().disabled).toBe(false);
    expect(await fixture.componentInstance.canLeave()).toBe(true);
  });

  it('shows imperial beside metric for people who asked for both', async () => {
    await open('3', [aDraft()], aUser({ units: 'metric+imperial' }));
    expect(text('mat-hint', field('f-scope-sizeMaxMm').closest('mat-form-field')!)).toBe('= 40.0 mm (1.575 in)');
    expect(text('mat-hint', field('f-cutting-feedMmS').closest('mat-form-field')!)).toBe('= 0.50 mm/s (1.18 in/min)');
  });

  describe('cut motion settings', () => {
    const cutting = () => fixture.componentInstance['form'].controls.content.controls.cutting.controls;
    /** The label and unit of each motion-setting field shown, in order. */
    const shownSettings = () =>
      [...root.querySelectorAll('[data-testid="motion-settings"] mat-form-field')].map(
        (f) => `${text('mat-label', f)} [${text('.mat-mdc-form-field-text-suffix', f)}]`,
      );

    it('shows the settings of the chosen motion only, each with its unit', async () => {
      await open('3', [aDraft()]);
      expect(root.querySelector('[data-testid="motion-settings"]')).toBeNull();

      const loader = TestbedHarnessEnvironment.loader(fixture);
      const motion = await loader.getHarness(MatSelectHarness.with({ selector: '#f-cutting-cutMotion' }));
      await motion.clickOptions({ text: 'Pulsed plunge' });
      await until(() =>
        expect(shownSettings()).toEqual(['Advance per pulse [mm]', 'Retract per pulse [mm]', 'Feeding time per pulse [s]', 'Pause between pulses [s]']),
      );
      expect(text('[data-testid="motion-settings-hint"]')).toContain('or the pulse times');

      cutting().cutMotion.setValue('rocking');
      await until(() => expect(shownSettings()).toEqual(['Rocking angle (total swing) [°]', 'Rocking stroke [mm]']));
      expect(root.querySelector('#f-cutting-pulseAdvanceMm')).toBeNull();
      cutting().cutMotion.setValue('turning-specimen');
      await until(() => expect(shownSettings()).toEqual(['Specimen speed [rpm]']));
      cutting().cutMotion.setValue('traverse-pass');
      await until(() => expect(shownSettings()).toEqual(['Depth per pass [mm]']));
      expect(root.querySelector('#f-cutting-passes')).not.toBeNull();
      cutting().cutMotion.setValue('stepped-depth');
      await until(() => expect(shownSettings()).toEqual(['Step depth [mm]']));
      cutting().cutMotion.setValue('straight-plunge');
      await until(() => expect(root.querySelector('[data-testid="motion-settings"]')).toBeNull());
    });

    it('loads content stored without settings as "not given", flags a pulse that gains nothing, and saves the chosen motion’s settings only', async () => {
      const draft = aDraft();
      draft.content.cutting.cutMotion = 'pulsed-plunge';
      // As an older Kerfbook stored it: no motion-setting keys at all.
      for (const key of Object.keys(NO_MOTION_SETTINGS)) delete (draft.content.cutting as Record<string, unknown>)[key];
      await open('3', [draft]);
      await until(() => expect(root.querySelector('#f-cutting-pulseAdvanceMm')).not.toBeNull());
      expect(field('f-cutting-pulseAdvanceMm').value).toBe('');
      expect(cutting().pulseAdvanceMm.value).toBeNull();
      expect(text('[data-testid="save-status"]')).not.toContain('Unsaved');

      // A value left from another motion stays in the form but is not saved.
      cutting().rockingStrokeMm.setValue(8);
      type('f-cutting-pulseAdvanceMm', '0.3');
      type('f-cutting-pulseRetractMm', '0.3');
      await until(() => expect(root.querySelector('[data-check="pulse-retract-not-below-advance"]')).not.toBeNull());
      expect(text('.kb-check-message', root.querySelector('[data-check="pulse-retract-not-below-advance"]')!)).toContain('gains 0 mm per pulse');
      type('f-cutting-pulseRetractMm', '0.1');
      await until(() => expect(root.querySelector('[data-check="pulse-retract-not-below-advance"]')).toBeNull());

      // Out of range: the schema's message on the field.
      type('f-cutting-pulsePauseS', '0');
      field('f-cutting-pulsePauseS').dispatchEvent(new Event('blur'));
      await until(() =>
        expect(text('mat-error', field('f-cutting-pulsePauseS').closest('mat-form-field')!)).toBe('Pause between pulses must be more than 0 s.'),
      );
      type('f-cutting-pulsePauseS', '1');

      clickSave();
      const req = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
      const sent = (req.request.body as SaveDraftBody).content.cutting;
      expect(sent).toMatchObject({
        cutMotion: 'pulsed-plunge',
        pulseAdvanceMm: 0.3,
        pulseRetractMm: 0.1,
        pulseFeedS: null,
        pulsePauseS: 1,
        rockingStrokeMm: null,
      });
      req.flush(aDraft({ revision: 5 }));
    });
  });

  describe('wheel path through a coating', () => {
    async function chooseWheelPath(option: string): Promise<void> {
      const loader = TestbedHarnessEnvironment.loader(fixture);
      const select = await loader.getHarness(MatSelectHarness.with({ selector: '#f-clamping-wheelPath' }));
      await select.clickOptions({ text: option });
    }

    it('is asked for a coated material only', async () => {
      await open('3', [aDraft()]);
      expect(root.querySelector('#f-clamping-wheelPath')).toBeNull();
      fixture.componentInstance['form'].controls.content.controls.scope.controls.materialId.setValue(6);
      await until(() => expect(root.querySelector('#f-clamping-wheelPath')).not.toBeNull());
    });

    /** A draft of the coated material, stored as an older Kerfbook stored it: no wheelPath key. */
    function olderCoatedDraft(): RecipeVersionDto {
      const draft = aDraft();
      draft.content.scope.materialId = 6;
      delete (draft.content.clamping as Partial<typeof draft.content.clamping>).wheelPath;
      return draft;
    }

    it('loads content stored without it as "not given", unchanged, with the live warning that it is missing', async () => {
      await open('3', [olderCoatedDraft()]);
      await until(() => expect(root.querySelector('#f-clamping-wheelPath')).not.toBeNull());
      expect(fixture.componentInstance['form'].controls.content.controls.clamping.controls.wheelPath.value).toBeNull();
      // Loading older content is not a change.
      expect(text('[data-testid="save-status"]')).not.toContain('Unsaved');
      await until(() => expect(root.querySelector('[data-check="orientation-rule-missing"]')).not.toBeNull());
      expect(text('.kb-check-message', root.querySelector('[data-check="orientation-rule-missing"]')!)).toContain('where the wheel enters and leaves');
    });

    it('warns live when the chosen path leaves through the coating, and saves the path chosen', async () => {
      await open('3', [olderCoatedDraft()]);
      await chooseWheelPath('Enters through the substrate, leaves through the coating');
      await until(() => expect(root.querySelector('[data-check="wheel-exits-coating"]')).not.toBeNull());
      expect(root.querySelector('[data-check="orientation-rule-missing"]')).toBeNull();
      expect(text('.kb-check-message', root.querySelector('[data-check="wheel-exits-coating"]')!)).toContain('peels the coating');

      fixture.componentInstance['form'].controls.content.controls.clamping.controls.wheelPath.setValue('enters-coating');
      await until(() => expect(root.querySelector('[data-check="wheel-exits-coating"]')).toBeNull());
      clickSave();
      const req = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/recipes/3/versions/1' }));
      expect((req.request.body as SaveDraftBody).content.clamping.wheelPath).toBe('enters-coating');
      req.flush(aDraft({ revision: 5 }));
    });
  });

  it('creates a new recipe with POST and moves on to its edit page', async () => {
    await open(undefined, []);
    type('f-title', 'Cast iron housings');
    const scopeMaterial = fixture.componentInstance['form'].controls.content.controls.scope.controls.materialId;
    scopeMaterial.setValue(5);
    const cutting = fixture.componentInstance['form'].controls.content.controls.cutting.controls;
    cutting.machineId.setValue(1);
    cutting.wheelId.setValue(2);
    type('f-scope-sizeMinMm', '20');
    type('f-scope-sizeMaxMm', '60');
    type('f-cutting-wheelRpm', '2800');
    type('f-cutting-feedMmS', '0.2');
    type('f-coolant-concentrationPct', '4');
    await fixture.whenStable();
    [...root.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Create draft'))!.click();
    const create = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/recipes' }));
    expect(create.request.body.title).toBe('Cast iron housings');
    expect(create.request.body.content.scope.group).toBe('plain-low-alloy-steel');
    expect(create.request.body.revision).toBeUndefined();
    create.flush(aDraft({ recipeId: 12, revision: 0 }), { status: 201, statusText: 'Created' });
    const router = TestBed.inject(Router);
    await vi.waitFor(() => expect(router.navigate).toHaveBeenCalledWith(['/recipes', 12, 'edit'], { replaceUrl: true }));
  });
});
