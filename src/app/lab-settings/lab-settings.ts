import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { z } from 'zod';
import { describeCeilingBand } from '@shared/feed-ceilings';
import {
  type FeedCeiling,
  type LabSettingsBody,
  type LabSettingsDto,
  kerfAllowance,
  labSettingsBody,
  longContactLength,
  powerWarningShare,
  reviewInterval,
  sealInterval,
  specificEnergy,
  traverseRemovalCeiling,
  wornDiameterShare,
} from '@shared/schemas/lab-settings';
import { requiredText } from '@shared/schemas/numbers';
import { hardnessWindow } from '@shared/schemas/stock';
import {
  DATE_FORMATS,
  DATE_FORMAT_LABELS,
  HARDNESS_SCALES,
  MACHINE_CLASSES,
  MACHINE_CLASS_LABELS,
  MATERIAL_GROUPS,
  MATERIAL_GROUP_LABELS,
  type MachineClass,
  type MaterialGroup,
  SHEET_PAPERS,
  SHEET_PAPER_LABELS,
  UNIT_PREFERENCES,
  UNIT_PREFERENCE_LABELS,
} from '@shared/vocabulary';
import { LabSettingsApi } from '../core/api/lab-settings-api';
import { LabDateFormat } from '../core/dates/lab-date-format';
import { LabDatePipe } from '../core/dates/lab-date-pipe';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { Notifier } from '../core/notifier/notifier';
import { DecimalInput } from '../ui/decimal-input';
import { toFieldErrors } from '@shared/validation';

/** A field that may be left empty (no value for that group); when filled, the schema decides. */
function optional(schema: z.ZodType): ValidatorFn {
  const check = zodValidator(schema);
  return (control) => (control.value === null || control.value === '' ? null : check(control));
}

type NumberControl = FormControl<number | null>;

interface CeilingForm {
  group: FormControl<MaterialGroup>;
  machineClass: FormControl<MachineClass>;
  hardness: FormControl<FeedCeiling['hardness']>;
  maxFeedMmS: NumberControl;
}

/**
 * Lab settings (admin): the lab's name, bench sheet paper, review interval, default units and
 * date format, and the limits the recipe checks use. Checked with the server's schema before
 * saving; saved whole against the revision it was opened at.
 */
@Component({
  selector: 'kb-lab-settings',
  imports: [
    DecimalInput,
    LabDatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './lab-settings.html',
  styleUrl: './lab-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabSettings {
  private readonly api = inject(LabSettingsApi);
  private readonly dates = inject(LabDateFormat);
  private readonly notifier = inject(Notifier);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly machineClasses = MACHINE_CLASSES.map((id) => ({ id, label: MACHINE_CLASS_LABELS[id] }));
  protected readonly papers = SHEET_PAPERS.map((id) => ({ id, label: SHEET_PAPER_LABELS[id] }));
  protected readonly unitOptions = UNIT_PREFERENCES.map((id) => ({ id, label: UNIT_PREFERENCE_LABELS[id] }));
  protected readonly dateFormats = DATE_FORMATS.map((id) => ({ id, label: DATE_FORMAT_LABELS[id] }));
  protected readonly scales = HARDNESS_SCALES;
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly classLabel = MACHINE_CLASS_LABELS;
  protected readonly controlMessage = controlMessage;

  protected readonly loaded = signal<LabSettingsDto | null>(null);
  protected readonly loadFailed = signal(false);
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  /** Set when another save came first: the settings as they now are. */
  protected readonly conflict = signal<LabSettingsDto | null>(null);

  protected readonly form = this.fb.group({
    labName: ['', zodValidator(requiredText('Lab name', 120))],
    sheetPaper: this.fb.control<LabSettingsBody['sheetPaper']>('A4'),
    reviewIntervalMonths: new FormControl<number | null>(null, zodValidator(reviewInterval)),
    defaultUnits: this.fb.control<LabSettingsBody['defaultUnits']>('metric'),
    dateFormat: this.fb.control<LabSettingsBody['dateFormat']>('iso'),
    sealIntervalHours: new FormControl<number | null>(null, zodValidator(sealInterval)),
    longContactMm: new FormControl<number | null>(null, optional(longContactLength)),
    wornDiameterShare: new FormControl<number | null>(null, zodValidator(wornDiameterShare)),
    kerfAllowanceMm: new FormControl<number | null>(null, zodValidator(kerfAllowance)),
    powerWarningPct: new FormControl<number | null>(null, zodValidator(powerWarningShare)),
    specificEnergyJMm3: new FormGroup(
      Object.fromEntries(MATERIAL_GROUPS.map((g) => [g, new FormControl<number | null>(null, optional(specificEnergy))])) as Record<
        MaterialGroup,
        NumberControl
      >,
    ),
    traverseRemovalCeilings: new FormGroup(
      Object.fromEntries(MATERIAL_GROUPS.map((g) => [g, new FormControl<number | null>(null, optional(traverseRemovalCeiling))])) as Record<
        MaterialGroup,
        NumberControl
      >,
    ),
    feedCeilings: new FormArray<FormGroup<CeilingForm>>([]),
  });

  /** The row an admin is about to add to the feed ceilings. */
  protected readonly newCeiling = this.fb.group({
    group: this.fb.control<MaterialGroup>('plain-low-alloy-steel'),
    machineClass: this.fb.control<MachineClass>('bench-abrasive'),
    hardnessMin: new FormControl<number | null>(null),
    hardnessMax: new FormControl<number | null>(null),
    hardnessScale: this.fb.control<(typeof HARDNESS_SCALES)[number]>('HV'),
    maxFeedMmS: new FormControl<number | null>(null),
  });
  protected readonly newCeilingError = signal('');

  constructor() {
    void this.load();
  }

  protected async load(): Promise<void> {
    this.loadFailed.set(false);
    try {
      this.show(await firstValueFrom(this.api.get()));
    } catch {
      this.loadFailed.set(true);
    }
  }

  private ceilingGroup(row: FeedCeiling): FormGroup<CeilingForm> {
    return this.fb.group({
      group: this.fb.control(row.group),
      machineClass: this.fb.control(row.machineClass),
      hardness: this.fb.control(row.hardness),
      maxFeedMmS: new FormControl<number | null>(row.maxFeedMmS, zodValidator(labSettingsBody.shape.feedCeilings.element.shape.maxFeedMmS)),
    });
  }

  protected show(settings: LabSettingsDto): void {
    this.loaded.set(settings);
    this.conflict.set(null);
    this.formError.set('');
    const perGroup = (values: Partial<Record<MaterialGroup, number>>) =>
      Object.fromEntries(MATERIAL_GROUPS.map((g) => [g, values[g] ?? null])) as Record<MaterialGroup, number | null>;
    const f = this.form;
    f.controls.feedCeilings.clear({ emitEvent: false });
    for (const row of settings.feedCeilings) f.controls.feedCeilings.push(this.ceilingGroup(row), { emitEvent: false });
    f.reset({
      labName: settings.labName,
      sheetPaper: settings.sheetPaper,
      reviewIntervalMonths: settings.reviewIntervalMonths,
      defaultUnits: settings.defaultUnits,
      dateFormat: settings.dateFormat,
      sealIntervalHours: settings.sealIntervalHours,
      longContactMm: settings.longContactMm,
      wornDiameterShare: settings.wornDiameterShare,
      kerfAllowanceMm: settings.kerfAllowanceMm,
      powerWarningPct: settings.powerWarningPct,
      specificEnergyJMm3: perGroup(settings.specificEnergyJMm3),
      traverseRemovalCeilings: perGroup(settings.traverseRemovalCeilings),
      // Named here too: a reset without them would empty the rows just added.
      feedCeilings: settings.feedCeilings,
    });
  }

  protected bandOf(row: FormGroup<CeilingForm>): string {
    return describeCeilingBand({ ...row.getRawValue(), maxFeedMmS: 0 });
  }

  protected removeCeiling(index: number): void {
    this.form.controls.feedCeilings.removeAt(index);
    this.form.markAsDirty();
  }

  protected addCeiling(): void {
    this.newCeilingError.set('');
    // A number the field could not read is null behind it: an unreadable hardness would add a row for any hardness.
    if (this.newCeiling.invalid) {
      this.newCeiling.markAllAsTouched();
      this.newCeilingError.set('Nothing was added: correct the values marked in red.');
      return;
    }
    const v = this.newCeiling.getRawValue();
    const banded = v.hardnessMin !== null || v.hardnessMax !== null;
    const hardness = banded
      ? hardnessWindow.safeParse({ min: v.hardnessMin ?? v.hardnessMax, max: v.hardnessMax ?? v.hardnessMin, scale: v.hardnessScale })
      : null;
    if (hardness && !hardness.success) {
      this.newCeilingError.set(toFieldErrors(hardness.error)[0]!.message);
      return;
    }
    const row = labSettingsBody.shape.feedCeilings.element.safeParse({
      group: v.group,
      machineClass: v.machineClass,
      hardness: hardness ? hardness.data : null,
      maxFeedMmS: v.maxFeedMmS,
    });
    if (!row.success) {
      this.newCeilingError.set(toFieldErrors(row.error)[0]!.message);
      return;
    }
    this.form.controls.feedCeilings.push(this.ceilingGroup(row.data));
    this.form.markAsDirty();
    this.newCeiling.patchValue({ hardnessMin: null, hardnessMax: null, maxFeedMmS: null });
  }

  /** The body as the form holds it; empty per-group fields are left out (no value for that group). */
  private body(): unknown {
    const v = this.form.getRawValue();
    const filled = (values: Record<string, number | null>) => Object.fromEntries(Object.entries(values).filter(([, n]) => n !== null && (n as unknown) !== ''));
    return {
      ...v,
      longContactMm: v.longContactMm === null || (v.longContactMm as unknown) === '' ? null : v.longContactMm,
      specificEnergyJMm3: filled(v.specificEnergyJMm3),
      traverseRemovalCeilings: filled(v.traverseRemovalCeilings),
      revision: this.loaded()?.revision ?? 0,
    };
  }

  protected async save(): Promise<void> {
    this.formError.set('');
    const parsed = labSettingsBody.safeParse(this.body());
    if (!parsed.success) {
      const rest = applyServerErrors(this.form, toFieldErrors(parsed.error));
      this.form.markAllAsTouched();
      this.formError.set(['Nothing was saved: correct the values marked in red.', ...rest].join(' '));
      return;
    }
    this.busy.set(true);
    try {
      const saved = await firstValueFrom(this.api.save(parsed.data));
      this.show(saved);
      this.dates.set(saved.dateFormat);
      void this.notifier.show('The lab settings have been saved.', 'OK', 4000);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 409) {
        const current = (e.body as { current?: LabSettingsDto } | null)?.current ?? null;
        this.conflict.set(current);
        this.formError.set(e.generalMessage);
      } else {
        const rest = applyServerErrors(this.form, e.errors);
        this.formError.set(['Nothing was saved.', ...rest].join(' '));
      }
    } finally {
      this.busy.set(false);
    }
  }

  /** After a conflict: take the settings as they now are (the changes made here are dropped). */
  protected reloadCurrent(): void {
    const current = this.conflict();
    if (current) this.show(current);
  }
}
