import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import { aMaterial } from '../../testing/stock-and-recipe-fixtures';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { MaterialFormDialog, type MaterialFormDialogData } from './material-form-dialog';

describe('MaterialFormDialog', () => {
  let fixture: ComponentFixture<MaterialFormDialog>;
  let backend: HttpTestingController;
  let root: HTMLElement;
  let dialogRef: { close: ReturnType<typeof vi.fn> };
  let notifier: { show: ReturnType<typeof vi.fn> };

  async function open(data: MaterialFormDialogData): Promise<void> {
    dialogRef = { close: vi.fn() };
    notifier = { show: vi.fn() };
    TestBed.configureTestingModule({
      imports: [MaterialFormDialog],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: dialogRef },
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: Notifier, useValue: notifier },
        { provide: Session, useValue: { clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MaterialFormDialog);
    root = fixture.nativeElement;
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function type(name: string, value: string): void {
    const input = root.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[formcontrolname="${name}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  function submit(): void {
    root.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
  }

  async function text(testId: string): Promise<string> {
    await fixture.whenStable();
    return root.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? '';
  }

  async function choose(label: string, option: string): Promise<void> {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const selects = await loader.getAllHarnesses(MatSelectHarness);
    for (const select of selects) {
      const host = await select.host();
      if ((await host.getAttribute('formcontrolname')) === label) return select.clickOptions({ text: option });
    }
    throw new Error(`no select ${label}`);
  }

  async function tick(label: string): Promise<void> {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatCheckboxHarness.with({ label }))).check();
  }

  async function fillNewMaterial(): Promise<void> {
    type('name', 'Tool steel block');
    type('designation', 'EN 1.2379');
    await choose('group', 'Hardened and tool steels');
    type('condition', 'hardened and tempered');
    type('value', '60');
    await choose('scale', 'HRC');
  }

  it('creates a material with the typed values', async () => {
    await open({});
    await fillNewMaterial();
    await tick('Heat-sensitive');
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/materials' }));
    expect(req.request.body).toEqual({
      name: 'Tool steel block',
      designation: 'EN 1.2379',
      group: 'hardened-tool-steel',
      condition: 'hardened and tempered',
      hardness: { value: 60, scale: 'HRC' },
      coated: false,
      coatingHardness: null,
      caseHardened: false,
      caseDepthMm: null,
      heatSensitive: true,
      hazardousDust: false,
      combustibleFines: false,
      notes: '',
    });
    const saved = aMaterial({ id: 21, name: 'Tool steel block' });
    req.flush(saved, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalledWith(saved));
  });

  it('sends the fire flag for fines that can burn when it is ticked', async () => {
    await open({});
    await fillNewMaterial();
    await tick('Fines can burn (magnesium, titanium, zirconium)');
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/materials' }));
    expect(req.request.body).toMatchObject({ combustibleFines: true, hazardousDust: false });
    req.flush(aMaterial({ id: 22, combustibleFines: true }), { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it("asks a coated material for its coating's hardness, and drops it when the material is not coated", async () => {
    await open({});
    await fillNewMaterial();
    expect(root.querySelector('[data-testid="coating-hardness"]')).toBeNull();
    await tick('Coated or surface-treated');
    await fixture.whenStable();
    const coating = root.querySelector<HTMLInputElement>('[data-testid="coating-hardness"]')!;
    coating.value = '1150';
    coating.dispatchEvent(new Event('input'));
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'POST', url: '/api/materials' }));
    expect(req.request.body).toMatchObject({ coated: true, coatingHardness: { value: 1150, scale: 'HV' }, hardness: { value: 60, scale: 'HRC' } });
    req.flush(aMaterial({ id: 22, coated: true, coatingHardness: { value: 1150, scale: 'HV' } }), { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it('sends no coating hardness once "coated" is unticked', async () => {
    await open({ material: aMaterial({ coated: true, coatingHardness: { value: 900, scale: 'HV' } }) });
    expect(root.querySelector<HTMLInputElement>('[data-testid="coating-hardness"]')!.value).toBe('900');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Coated or surface-treated' }))).uncheck();
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/materials/5' }));
    expect(req.request.body).toMatchObject({ coated: false, coatingHardness: null });
    req.flush(aMaterial());
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });

  it("checks the fields with the shared schema's words before sending", async () => {
    await open({});
    type('name', '   ');
    type('value', '-3');
    submit();
    expect(await text('name-error')).toBe('Name is required.');
    expect(await text('group-error')).toBe('Choose a material group.');
    expect(await text('hardness-error')).toBe('Hardness must be more than 0 on its scale.');
    backend.expectNone('/api/materials');
  });

  it('asks for the case depth of a case-hardened material (a rule across fields) without asking the server', async () => {
    await open({});
    await fillNewMaterial();
    await tick('Case-hardened');
    submit();
    expect(await text('caseDepthMm-error')).toBe('Give the case depth of a case-hardened material.');
    backend.expectNone('/api/materials');
  });

  it('puts 400 field errors beside their fields, and the rest above the form, without a snack bar', async () => {
    await open({});
    await fillNewMaterial();
    submit();
    (await vi.waitFor(() => backend.expectOne('/api/materials'))).flush(
      {
        code: 'VALIDATION_FAILED',
        errors: [
          { path: 'designation', message: 'Designation is already used by another material.' },
          { path: 'hardness.value', message: 'Hardness is outside the HRC scale.' },
          { path: '', message: 'Check the marked fields.' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await vi.waitFor(async () => expect(await text('designation-error')).toBe('Designation is already used by another material.'));
    expect(await text('hardness-error')).toBe('Hardness is outside the HRC scale.');
    expect(await text('form-error')).toBe('Check the marked fields.');
    expect(notifier.show).not.toHaveBeenCalled();
    expect(dialogRef.close).not.toHaveBeenCalled();
  });

  it('edits an existing material with PUT, keeping what was not changed', async () => {
    const material = aMaterial({ caseHardened: true, caseDepthMm: 0.6, hazardousDust: true });
    await open({ material });
    type('condition', 'annealed');
    submit();
    const req = await vi.waitFor(() => backend.expectOne({ method: 'PUT', url: '/api/materials/5' }));
    expect(req.request.body).toMatchObject({
      condition: 'annealed',
      caseHardened: true,
      caseDepthMm: 0.6,
      hazardousDust: true,
      hardness: { value: 32, scale: 'HRC' },
    });
    req.flush({ ...material, condition: 'annealed' });
    await vi.waitFor(() => expect(dialogRef.close).toHaveBeenCalled());
  });
});
