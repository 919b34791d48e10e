import { LowerCasePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, type ValidatorFn } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, firstValueFrom, map, of, startWith, switchMap } from 'rxjs';
import type { FinderHit } from '@shared/recipe-types';
import { hasAccess } from '@shared/roles';
import { type FinderQuery, finderQuery } from '@shared/schemas/operator';
import type { MaterialRecord } from '@shared/stock-types';
import {
  HARDNESS_SCALES,
  type HardnessScale,
  MATERIAL_GROUPS,
  MATERIAL_GROUP_LABELS,
  type MaterialGroup,
  SHAPES,
  SHAPE_LABELS,
  type Shape,
} from '@shared/vocabulary';
import { askToAcknowledge } from '../../ui/acknowledge-dialog';
import { mustAcknowledge } from '../../ui/acknowledgement-state';
import { controlMessage } from '../../core/forms/control-message';
import { applyServerErrors } from '../../core/forms/server-errors';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { LogCutDialog, type LogCutDialogData } from '../../ui/log-cut-dialog/log-cut-dialog';
import { benchSheetUrl, openInNewTab } from '../../core/api/bench-sheet';
import { RecipeApi } from '../../core/api/recipe-api';
import { StockApi } from '../../core/api/stock-api';
import { FinderApi } from './finder-api';
import { finderParams, isEmptyQuery, readFinderParams } from './finder-params';
import { DecimalInput } from '../../ui/decimal-input';
import { ReviewOverdueChip } from '../../ui/review-overdue-chip';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

type Results = { state: 'idle' } | { state: 'loading' } | { state: 'failed'; message: string } | { state: 'ready'; hits: FinderHit[] };

/** An optional number field checked with the shared schema's words; empty is fine. */
function optionalNumber(schema: (typeof finderQuery.shape)['sizeMm' | 'hardnessValue']): ValidatorFn {
  const check = zodValidator(schema);
  return (control) => (control.value === null || control.value === '' ? null : check(control));
}

/**
 * Finder (the operator's home, made for a tablet at the saw): what is in hand — material or group,
 * hardness, shape, size, machine — to the current approved recipes that cover it, best
 * first, with a bench sheet and a cut log one tap away. The query lives in the URL.
 */
@Component({
  selector: 'kb-finder',
  imports: [
    LabDatePipe,
    DecimalInput,
    LowerCasePipe,
    MatAutocompleteModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
    ReviewOverdueChip,
    RouterLink,
  ],
  templateUrl: './finder.html',
  styleUrl: './finder.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Finder {
  private readonly api = inject(FinderApi);
  private readonly recipes = inject(RecipeApi);
  private readonly stock = inject(StockApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly form = this.fb.group({
    /** Typed text while searching, the record once one is picked. */
    material: this.fb.control<string | MaterialRecord>(''),
    group: this.fb.control<MaterialGroup | ''>(''),
    hardnessValue: this.fb.control<number | null>(null, [optionalNumber(finderQuery.shape.hardnessValue)]),
    hardnessScale: this.fb.control<HardnessScale>('HV'),
    shape: this.fb.control<Shape | ''>(''),
    sizeMm: this.fb.control<number | null>(null, [optionalNumber(finderQuery.shape.sizeMm)]),
    machineId: this.fb.control<number | null>(null),
  });

  protected readonly groups = MATERIAL_GROUPS.map((value) => ({ value, label: MATERIAL_GROUP_LABELS[value] }));
  protected readonly shapes = SHAPES.map((value) => ({ value, label: SHAPE_LABELS[value] }));
  protected readonly scales = HARDNESS_SCALES;
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly shapeLabel = SHAPE_LABELS;
  protected readonly controlMessage = controlMessage;

  /** Non-archived materials and machines; the server lists at most 200 of each, plenty for one lab. */
  protected readonly materials = toSignal(
    this.stock.materials.list({ archived: 'no', pageSize: 200, sort: 'name' }).pipe(
      map((page) => page.items),
      catchError(() => of<MaterialRecord[]>([])),
    ),
    { initialValue: [] },
  );
  protected readonly machines = toSignal(
    this.stock.machines.list({ archived: 'no', pageSize: 200, sort: 'name' }).pipe(
      map((page) => page.items),
      catchError(() => of([])),
    ),
    { initialValue: [] },
  );

  private readonly materialText = toSignal(this.form.controls.material.valueChanges, { initialValue: '' as string | MaterialRecord });
  protected readonly pickedMaterial = computed(() => {
    const value = this.materialText();
    return typeof value === 'object' ? value : null;
  });
  protected readonly materialOptions = computed(() => {
    const value = this.materialText();
    const text = (typeof value === 'string' ? value : value.name).trim().toLowerCase();
    const all = this.materials();
    if (!text) return all;
    return all.filter((m) => m.name.toLowerCase().includes(text) || m.designation.toLowerCase().includes(text));
  });

  private readonly sizeValue = toSignal(this.form.controls.sizeMm.valueChanges, { initialValue: null as number | null });
  /** Imperial users see the size in inches beside the millimetres they type. */
  protected readonly sizeHint = computed(() => {
    const size = this.sizeValue();
    if (this.session.user()?.units !== 'metric+imperial') return 'Across the cut, in millimetres.';
    if (size === null || !(Number(size) > 0)) return 'In millimetres (1 in = 25.4 mm).';
    return `${size} mm = ${(Number(size) / 25.4).toFixed(2)} in`;
  });

  protected readonly query = toSignal(this.route.queryParamMap.pipe(map(readFinderParams)), { initialValue: {} as FinderQuery });
  protected readonly results = signal<Results>({ state: 'idle' });
  protected readonly formError = signal('');
  protected readonly isOperator = computed(() => hasAccess(this.session.roles(), ['operator']));
  protected readonly sheetUrl = (hit: FinderHit) => benchSheetUrl(hit.summary.id, hit.summary.version);
  /**
   * An operator's first assigned machine, the machine filter until they choose another.
   * Read defensively: a session from an older server has no machineIds.
   */
  private readonly defaultMachineId = computed(() => {
    if (!this.isOperator()) return null;
    const ids: unknown = (this.session.user() as { machineIds?: unknown } | null)?.machineIds;
    return Array.isArray(ids) && typeof ids[0] === 'number' ? ids[0] : null;
  });

  constructor() {
    this.route.queryParamMap
      .pipe(
        map(readFinderParams),
        switchMap((query) => {
          this.fill(query);
          if (isEmptyQuery(query)) return of<Results>({ state: 'idle' });
          return this.api.find(query, callerHandles(400)).pipe(
            map((hits): Results => ({ state: 'ready', hits: [...hits].sort((a, b) => b.score - a.score) })),
            catchError((e: unknown) => {
              if (isApiError(e) && e.status === 400) {
                const unmatched = applyServerErrors(
                  this.form,
                  e.errors.map((x) => (x.path === 'materialId' ? { ...x, path: 'material' } : x)),
                );
                return of<Results>({ state: 'failed', message: unmatched.join(' ') || 'Correct the fields marked in red.' });
              }
              return of<Results>({ state: 'failed', message: 'The search could not be run. Try again in a moment.' });
            }),
            startWith<Results>({ state: 'loading' }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((results) => this.results.set(results));

    // A picked material says its group; the group field waits until the material is cleared.
    effect(() => {
      const group = this.form.controls.group;
      const material = this.pickedMaterial();
      if (material) {
        group.setValue(material.group, { emitEvent: false });
        group.disable({ emitEvent: false });
      } else {
        group.enable({ emitEvent: false });
      }
    });

    // A material id from the URL shows as its name once the list is in.
    effect(() => {
      const id = this.query().materialId;
      const list = this.materials();
      const current = this.form.controls.material.value;
      if (!id || typeof current === 'object') return;
      const found = list.find((m) => m.id === id);
      if (found) this.form.controls.material.setValue(found);
    });
  }

  protected displayMaterial(value: string | MaterialRecord | null): string {
    return value && typeof value === 'object' ? value.name : (value ?? '');
  }

  protected search(): void {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    if (typeof v.material === 'string' && v.material.trim()) {
      this.form.controls.material.setErrors({ message: 'Pick a material from the list, or clear the field and choose a group.' });
      this.form.controls.material.markAsTouched();
      return;
    }
    const material = typeof v.material === 'object' ? v.material : null;
    const query: FinderQuery = {
      materialId: material?.id,
      // A picked material already says its group.
      group: material ? undefined : v.group || undefined,
      hardnessValue: v.hardnessValue === null || String(v.hardnessValue) === '' ? undefined : Number(v.hardnessValue),
      shape: v.shape || undefined,
      sizeMm: v.sizeMm === null || String(v.sizeMm) === '' ? undefined : Number(v.sizeMm),
      machineId: v.machineId ?? undefined,
    };
    if (query.hardnessValue !== undefined) query.hardnessScale = v.hardnessScale;
    if (isEmptyQuery(query)) {
      this.formError.set('Fill in at least one field: the more you give, the better the matches.');
      return;
    }
    void this.router.navigate([], { relativeTo: this.route, queryParams: finderParams(query) });
  }

  protected clear(): void {
    this.formError.set('');
    this.form.reset();
    // Back to where the page starts: an operator's own machine.
    this.form.controls.machineId.setValue(this.defaultMachineId());
    void this.router.navigate([], { relativeTo: this.route, queryParams: {} });
  }

  protected async logCut(hit: FinderHit): Promise<void> {
    const s = hit.summary;
    const saved = await firstValueFrom(
      this.dialog
        .open(LogCutDialog, {
          data: { recipeId: s.id, number: s.number, title: s.title, version: s.version } satisfies LogCutDialogData,
          width: '600px',
          maxWidth: '95vw',
          autoFocus: 'first-tabbable',
        })
        .afterClosed(),
    );
    if (!saved) return;
    void this.notifier.show(
      saved.outcome === 'good'
        ? `Cut of specimen ${saved.specimenId} logged against ${saved.number} v${saved.version}.`
        : `Cut of specimen ${saved.specimenId} logged and flagged; the author of ${saved.number} will be told.`,
    );
  }

  /**
   * The hit does not say whether the operator still has to acknowledge its version, so ask
   * the version before opening the sheet; a version waiting for acknowledgement gets the
   * same print gate as the recipe page. Others follow the link as it is.
   */
  protected async printSheet(event: MouseEvent, hit: FinderHit): Promise<void> {
    if (!this.isOperator()) return;
    event.preventDefault();
    const s = hit.summary;
    // On failure the error interceptor has said why.
    const version = await firstValueFrom(this.recipes.version(s.id, s.version)).catch(() => null);
    if (!version) return;
    if (mustAcknowledge(version)) {
      await askToAcknowledge(this.dialog, { recipeId: s.id, number: s.number, title: s.title, version: s.version });
    } else if (!openInNewTab(this.sheetUrl(hit))) {
      void this.notifier.show(`The browser did not open the sheet of ${s.number}. Allow new tabs for Kerfbook, or print it from the recipe.`);
    }
  }

  /** Puts the URL's query into the form (on arrival, back and forward). */
  private fill(query: FinderQuery): void {
    const current = this.form.controls.material.value;
    const material = query.materialId
      ? (this.materials().find((m) => m.id === query.materialId) ?? (typeof current === 'object' && current.id === query.materialId ? current : ''))
      : '';
    this.form.setValue({
      material,
      group: query.group ?? '',
      hardnessValue: query.hardnessValue ?? null,
      hardnessScale: query.hardnessScale ?? 'HV',
      shape: query.shape ?? '',
      sizeMm: query.sizeMm ?? null,
      // Nothing asked yet (arrival, Clear): an operator's own machine. A search without one meant "any machine".
      machineId: query.machineId ?? (isEmptyQuery(query) ? this.defaultMachineId() : null),
    });
  }
}
