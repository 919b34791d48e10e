import { LowerCasePipe, NgTemplateOutlet } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  type OnInit,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { Subject, catchError, combineLatest, concatMap, debounceTime, firstValueFrom, forkJoin, from, map, merge, of, startWith } from 'rxjs';
import { PRECEDENCE_LINE, STANDARD_CAUTIONS } from '../../../../shared/cautions';
import { type CheckResult, changeReasonMissing, runChecks } from '../../../../shared/recipe-checks';
import type { RecipeContext } from '../../../../shared/recipe-context';
import { computeRecipe } from '../../../../shared/recipe-computations';
import type { RecipeVersionDto, StaleSaveBody } from '../../../../shared/recipe-types';
import type { HardnessValue } from '../../../../shared/schemas/stock';
import type { LabLimits, MachineRecord, MaterialRecord, SelectionRow, WheelRecord } from '../../../../shared/stock-types';
import { type QuantityKind, formatQuantity } from '../../../../shared/units';
import {
  CLAMPING_METHODS,
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPES,
  CUT_MOTIONS,
  CUT_MOTION_LABELS,
  CUT_ORIENTATIONS,
  HARDNESS_SCALES,
  MACHINE_CLASS_LABELS,
  MATERIAL_GROUPS,
  MATERIAL_GROUP_LABELS,
  type RecipeStatus,
  SHAPES,
  SHAPE_LABELS,
} from '../../../../shared/vocabulary';
import { suggestWheels } from '../../../../shared/wheel-suggestion';
import { controlMessage } from '../../core/forms/control-message';
import { applyServerErrors } from '../../core/forms/server-errors';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { CommentsPanel } from '../review/comments-panel';
import { WorkflowApi } from '../../core/api/workflow-api';
import { ConfirmDialog, type ConfirmDialogData } from '../../ui/confirm-dialog';
import { MarkdownView } from '../../ui/markdown-view';
import { RecipeAttachments } from './recipe-attachments';
import { RecipeEditorApi } from './recipe-editor-api';
import {
  FIELD_INFO,
  MOTIONS_WITH_PASSES,
  type RecipeFormValue,
  attachContentValidators,
  buildRecipeForm,
  fieldId,
  fromContent,
  revalidate,
  toContent,
} from './recipe-form';
import { RecipeLivePanel } from './recipe-live-panel';
import { type DraftBody, SaveConflictDialog, type SaveConflictDialogData } from './save-conflict-dialog';
import type { LeavesSafely } from './unsaved-changes-guard';

/** The live panel recomputes this long after the last keystroke. */
export const LIVE_DEBOUNCE_MS = 250;
/** A draft saves itself this long after the last change. */
export const AUTOSAVE_DEBOUNCE_MS = 3000;

const EDITABLE: readonly RecipeStatus[] = ['draft', 'returned'];

const STATUS_LABELS: Record<RecipeStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  returned: 'Returned for changes',
  approved: 'Approved',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};

const ORIENTATION_LABELS = { transverse: 'Transverse', longitudinal: 'Longitudinal', other: 'Other' } as const;
const COOLANT_LABELS = { 'water-soluble': 'Water-soluble coolant', oil: 'Cutting oil', dry: 'Dry (no coolant)' } as const;

/** The form's sections, in order, for the section links. */
const SECTIONS = [
  { id: 'scope', label: 'Scope', paths: ['scope.'] },
  { id: 'machine', label: 'Machine & wheel', paths: ['cutting.machineId', 'cutting.wheelId'] },
  { id: 'speeds', label: 'Speeds', paths: ['cutting.'] },
  { id: 'clamping', label: 'Clamping', paths: ['clamping.'] },
  { id: 'coolant', label: 'Coolant', paths: ['coolant.'] },
  { id: 'instructions', label: 'Instructions', paths: ['instructionsMd', 'acceptanceMd'] },
  { id: 'cautions', label: 'Cautions', paths: ['cautionsMd'] },
  { id: 'photos', label: 'Photos', paths: [] },
  { id: 'change', label: 'Change reason', paths: ['changeReason'] },
] as const;

type SaveState = 'idle' | 'saving' | 'conflict' | 'failed';

interface Stock {
  materials: MaterialRecord[];
  machines: MachineRecord[];
  wheels: WheelRecord[];
  rows: SelectionRow[];
  limits: LabLimits;
}

const EMPTY_STOCK: Stock = { materials: [], machines: [], wheels: [], rows: [], limits: { feedCeilingsMmS: {} } };

function bodyOf(value: RecipeFormValue): DraftBody {
  return { title: value.title, content: toContent(value.content) };
}

/**
 * A draft as comparable text: keys sorted (the server's JSON may order them differently) and
 * the content passed through the form's own mapping, so loading a draft never looks like a change.
 */
function snapshotOf(body: DraftBody): string {
  const sorted = (v: unknown): unknown =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, sorted((v as Record<string, unknown>)[k])]))
      : v;
  return JSON.stringify(sorted({ title: body.title, content: toContent(fromContent(body.content)) }));
}

/**
 * The recipe editor (`/recipes/new` and `/recipes/:id/edit`): a grouped form with the
 * computed values and checks beside it, updated live as the author types (design 5, 7).
 * Drafts save themselves a few seconds after the last change; every save carries the
 * revision it was based on, and a stale save opens the conflict dialog instead of
 * overwriting anyone.
 */
@Component({
  selector: 'kb-recipe-editor',
  imports: [
    CommentsPanel,
    LowerCasePipe,
    NgTemplateOutlet,
    MarkdownView,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    ReactiveFormsModule,
    RecipeAttachments,
    RecipeLivePanel,
    RouterLink,
  ],
  templateUrl: './recipe-editor.html',
  styleUrl: './recipe-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
})
export class RecipeEditor implements OnInit, LeavesSafely {
  private readonly api = inject(RecipeEditorApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly destroyRef = inject(DestroyRef);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly workflow = inject(WorkflowApi);

  /** Route parameter: the recipe to edit; absent on /recipes/new. */
  readonly id = input<string>();

  protected readonly form = buildRecipeForm(this.fb);
  protected readonly controls = this.form.controls.content.controls;
  protected readonly controlMessage = controlMessage;
  protected readonly fieldId = fieldId;
  protected readonly sections = SECTIONS;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly cautions = STANDARD_CAUTIONS;
  protected readonly precedenceLine = PRECEDENCE_LINE;
  protected readonly groups = MATERIAL_GROUPS.map((g) => ({ value: g, label: MATERIAL_GROUP_LABELS[g] }));
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly scales = HARDNESS_SCALES;
  protected readonly shapes = SHAPES.map((s) => ({ value: s, label: SHAPE_LABELS[s] }));
  protected readonly orientations = CUT_ORIENTATIONS.map((o) => ({ value: o, label: ORIENTATION_LABELS[o] }));
  protected readonly coolants = COOLANT_TYPES.map((c) => ({ value: c, label: COOLANT_LABELS[c] }));
  protected readonly machineClassLabel = MACHINE_CLASS_LABELS;

  protected readonly isNew = computed(() => !this.id());
  protected readonly recipeId = computed(() => Number(this.id()));
  protected readonly loading = signal(true);
  protected readonly loadError = signal('');
  protected readonly version = signal<RecipeVersionDto | null>(null);
  /** Why this version cannot be edited, or '' when it can. */
  protected readonly lockedReason = computed(() => {
    const v = this.version();
    if (!v || EDITABLE.includes(v.status)) return '';
    return `Version ${v.version} of ${v.number} is ${STATUS_LABELS[v.status].toLowerCase()}. Only drafts and versions returned for changes can be edited; submitted content stays as it was approved or reviewed.`;
  });

  private readonly stock = signal<Stock>(EMPTY_STOCK);
  protected readonly materials = computed(() => this.stock().materials);
  protected readonly machines = computed(() => this.stock().machines);
  protected readonly wheels = computed(() => this.stock().wheels);

  /** The form's raw value, updated on every change (not debounced). */
  protected readonly value = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), {
    initialValue: this.form.getRawValue(),
  });
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly imperial = computed(() => this.units() === 'metric+imperial');

  protected readonly material = computed(() => this.materials().find((m) => m.id === this.value().content.scope.materialId) ?? null);
  protected readonly machine = computed(() => this.machines().find((m) => m.id === this.value().content.cutting.machineId) ?? null);
  protected readonly wheel = computed(() => this.wheels().find((w) => w.id === this.value().content.cutting.wheelId) ?? null);

  /** Motions and clamping the chosen machine offers; a stored value it lacks stays listed so it is not lost. */
  protected readonly motionOptions = computed(() => {
    const offered = this.machine()?.cutMotions ?? CUT_MOTIONS;
    const current = this.value().content.cutting.cutMotion;
    return CUT_MOTIONS.filter((m) => offered.includes(m) || m === current).map((m) => ({
      value: m,
      label: CUT_MOTION_LABELS[m],
      offered: offered.includes(m),
    }));
  });
  protected readonly clampingOptions = computed(() => {
    const offered = this.machine()?.clampingMethods ?? CLAMPING_METHODS;
    const current = this.value().content.clamping.method;
    return CLAMPING_METHODS.filter((m) => offered.includes(m) || m === current).map((m) => ({
      value: m,
      label: CLAMPING_METHOD_LABELS[m],
      offered: offered.includes(m),
    }));
  });
  protected readonly needsPasses = computed(() => {
    const motion = this.value().content.cutting.cutMotion;
    return motion !== null && MOTIONS_WITH_PASSES.includes(motion);
  });

  /** Wheels the lab's selection table offers for the scope's group and hardness. */
  protected readonly suggestions = computed(() => {
    const scope = this.value().content.scope;
    if (!scope.group) return [];
    const { rows, wheels } = this.stock();
    let hardness: HardnessValue | null = null;
    const material = scope.by === 'material' ? this.material() : null;
    if (material?.hardness) hardness = material.hardness;
    else if (scope.hasHardness && scope.hardness.min !== null && scope.hardness.max !== null) {
      // A window is matched by its middle; the band check is a suggestion, not a rule.
      hardness = { value: (scope.hardness.min + scope.hardness.max) / 2, scale: scope.hardness.scale };
    }
    // Wheels the chosen machine takes come first; the others stay visible, marked.
    const fits = (w: WheelRecord) => this.wheelFitsMachine(w);
    const all = suggestWheels(scope.group, hardness, rows, wheels);
    return [...all.filter((s) => fits(s.wheel)), ...all.filter((s) => !fits(s.wheel))].slice(0, 3).map((s) => ({ ...s, fits: fits(s.wheel) }));
  });

  /** Computed values and checks, recomputed LIVE_DEBOUNCE_MS after the last change. */
  private readonly liveState = toSignal(
    combineLatest([
      this.form.valueChanges.pipe(
        startWith(null),
        debounceTime(LIVE_DEBOUNCE_MS),
        map(() => toContent(this.form.getRawValue().content)),
      ),
      toObservable(this.stock),
    ]).pipe(
      map(([content, stock]) => {
        const ctx: RecipeContext = {
          material: stock.materials.find((m) => m.id === content.scope.materialId) ?? null,
          machine: stock.machines.find((m) => m.id === content.cutting.machineId) ?? null,
          wheel: stock.wheels.find((w) => w.id === content.cutting.wheelId) ?? null,
          limits: stock.limits,
        };
        const computed = computeRecipe(content, ctx);
        return { computed, checks: runChecks(content, ctx, computed), at: this.value() };
      }),
    ),
    { initialValue: null },
  );
  protected readonly computedValues = computed(() => this.liveState()?.computed ?? null);
  /** Blockers and warnings by the section holding their field, repeated there so they are seen in context. */
  protected readonly sectionChecks = computed(() => {
    const bySection: Record<string, CheckResult[]> = {};
    for (const check of this.checks()) {
      if (check.severity === 'note' || !check.path) continue;
      const section = SECTIONS.find((s) => s.paths.some((p) => (p.endsWith('.') ? check.path!.startsWith(p) : check.path === p)));
      if (section) (bySection[section.id] ??= []).push(check);
    }
    return bySection;
  });
  protected readonly checks = computed(() => this.liveState()?.checks ?? []);
  protected readonly livePending = computed(() => this.liveState()?.at !== this.value());

  // Saving
  /** The revision the form's content is based on; every save carries it. */
  private readonly baseRevision = signal(0);
  /** Title and content as last saved (or loaded), to tell whether there is anything to save. */
  private readonly savedSnapshot = signal(snapshotOf(bodyOf(this.form.getRawValue())));
  private readonly snapshot = computed(() => snapshotOf(bodyOf(this.value())));
  protected readonly dirty = computed(() => this.snapshot() !== this.savedSnapshot());
  protected readonly saveState = signal<SaveState>('idle');
  protected readonly savedAt = signal<Date | null>(null);
  protected readonly formError = signal('');
  /** Review comments of this version; the panel shows only when there are some. */
  protected readonly commentCount = signal(0);
  protected readonly submitting = signal(false);
  /** Blockers the live checks find now: while any stands the version cannot be submitted. */
  protected readonly blockers = computed(() => this.checks().filter((c) => c.severity === 'blocker'));
  protected readonly canSubmit = computed(
    () => this.version()?.status === 'draft' && !this.lockedReason() && !this.dirty() && this.saveState() === 'idle' && !this.livePending() && this.blockers().length === 0,
  );
  private readonly valid = signal(false);
  private readonly saves = new Subject<'auto' | 'manual'>();

  protected readonly saveStatus = computed(() => {
    switch (this.saveState()) {
      case 'saving':
        return 'Saving…';
      case 'conflict':
        return 'Not saved: this draft was changed by someone else';
      case 'failed':
        return 'Not saved';
    }
    if (this.dirty()) return this.valid() || this.isNew() ? 'Unsaved changes' : 'Unsaved changes: complete the marked fields to save';
    const at = this.savedAt();
    return at ? `Saved ${at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}` : this.isNew() ? 'Not saved yet' : 'No changes';
  });

  constructor() {
    attachContentValidators(this.form);
    const scope = this.controls.scope.controls;
    // In "one material" mode the material is required, and it brings its group.
    scope.materialId.addValidators((c: AbstractControl): ValidationErrors | null =>
      scope.by.value === 'material' && c.value === null ? { zod: 'Choose a material, or scope the recipe by material group.' } : null,
    );
    merge(scope.materialId.valueChanges, scope.by.valueChanges)
      .pipe(takeUntilDestroyed())
      .subscribe(() => {
        const material = this.materials().find((m) => m.id === scope.materialId.value);
        if (material && scope.by.value === 'material' && scope.group.value !== material.group) scope.group.setValue(material.group);
      });
    this.controls.changeReason.addValidators((c: AbstractControl): ValidationErrors | null => {
      const missing = changeReasonMissing(this.version()?.version ?? 1, String(c.value));
      return missing ? { zod: missing } : null;
    });

    // Every change re-validates the whole form: one field can make another (in)valid.
    this.form.valueChanges.pipe(startWith(null), takeUntilDestroyed()).subscribe(() => {
      revalidate(this.form);
      this.valid.set(this.form.valid);
      if (this.saveState() === 'failed') this.saveState.set('idle');
    });

    this.form.valueChanges.pipe(debounceTime(AUTOSAVE_DEBOUNCE_MS), takeUntilDestroyed()).subscribe(() => {
      if (this.canAutosave()) this.saves.next('auto');
    });
    // One save at a time, each reading the revision the previous one left.
    this.saves.pipe(concatMap((kind) => from(this.persist(kind))), takeUntilDestroyed()).subscribe();
  }

  ngOnInit(): void {
    void this.load();
  }

  /** CanDeactivate: ask before unsaved input is thrown away. */
  async canLeave(): Promise<boolean> {
    if (!this.dirty() || this.lockedReason()) return true;
    return (
      (await firstValueFrom(
        this.dialog
          .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
            data: {
              title: 'Leave with unsaved changes?',
              message: ['Your latest changes to this recipe have not been saved.', 'If you leave now, they are lost.'],
              confirmLabel: 'Leave without saving',
            },
          })
          .afterClosed(),
      )) === true
    );
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.dirty() && !this.lockedReason()) event.preventDefault();
  }

  protected goToSection(id: string): void {
    const section = this.host.nativeElement.querySelector<HTMLElement>(`#sec-${id}`);
    section?.scrollIntoView?.({ behavior: 'smooth', block: 'start' });
    section?.querySelector<HTMLElement>('h2')?.focus({ preventScroll: true });
  }

  /** Takes the author to the field a check or an error points at ("cutting.wheelRpm"). */
  protected goToField(path: string): void {
    const parts = path.split('.');
    let target: HTMLElement | null = null;
    for (let n = parts.length; n > 0 && !target; n--) {
      target = this.host.nativeElement.querySelector<HTMLElement>(`#${fieldId(parts.slice(0, n).join('.'))}`);
    }
    if (!target) return;
    const control = this.controls.scope.root.get(['content', ...parts]);
    control?.markAsTouched();
    target.scrollIntoView?.({ behavior: 'smooth', block: 'center' });
    const focusable = target.matches('input, textarea, mat-select, [tabindex]')
      ? target
      : target.querySelector<HTMLElement>('input, textarea, mat-select, [tabindex]:not([tabindex="-1"])');
    (focusable ?? target).focus({ preventScroll: true });
  }

  protected applyWheel(wheelId: number): void {
    this.controls.cutting.controls.wheelId.setValue(wheelId);
    this.controls.cutting.controls.wheelId.markAsDirty();
  }

  /** Hint with the imperial value for people who asked to see both. */
  protected imperialHint(value: number | null, kind: QuantityKind): string {
    return this.imperial() && value !== null && Number.isFinite(value) ? `= ${formatQuantity(value, kind, 'metric+imperial')}` : '';
  }

  protected wheelLabel(w: WheelRecord): string {
    return `${w.name} · ${w.specification} · Ø${w.diameterMm} × ${w.thicknessMm} mm · max ${w.maxSpeedMs} m/s`;
  }

  protected wheelFitsMachine(w: WheelRecord): boolean {
    const m = this.machine();
    return !m || (w.diameterMm >= m.wheelDiameterMinMm && w.diameterMm <= m.wheelDiameterMaxMm);
  }

  protected saveNow(): void {
    this.formError.set('');
    revalidate(this.form);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Some fields are missing or out of range; they are marked below.');
      const first = this.host.nativeElement.querySelector<HTMLElement>('.ng-invalid[id^="f-"], .ng-invalid [id^="f-"]');
      if (first?.id) this.goToField(first.id.slice(2).replaceAll('-', '.'));
      return;
    }
    this.saves.next('manual');
  }

  /** Sends the saved draft for review, with the revision it was saved at; then shows it on the recipe page. */
  protected async submitForReview(): Promise<void> {
    const v = this.version();
    if (!v || !this.canSubmit()) return;
    this.formError.set('');
    this.submitting.set(true);
    try {
      const submitted = await firstValueFrom(this.workflow.submit(v.recipeId, v.version, { revision: this.baseRevision() }, callerHandles(409)));
      this.version.set(submitted);
      void this.notifier.show(`${submitted.number} version ${submitted.version} is waiting for review.`);
      void this.router.navigate(['/recipes', submitted.recipeId]);
    } catch (e) {
      if (!isApiError(e)) throw e;
      this.formError.set(
        e.code === 'BLOCKERS'
          ? `Not submitted; the server found blockers: ${e.errors.map((x) => x.message).join(' ')}`
          : 'Not submitted: this draft changed since it was loaded. Reload the page to see the current content.',
      );
    } finally {
      this.submitting.set(false);
    }
  }

  private canAutosave(): boolean {
    return !this.isNew() && !this.lockedReason() && this.saveState() !== 'conflict' && this.saveState() !== 'saving' && this.dirty() && this.form.valid;
  }

  private async load(): Promise<void> {
    this.loading.set(true);
    try {
      const [stock, versions] = await firstValueFrom(
        forkJoin([
          forkJoin({
            materials: this.api.materials(),
            machines: this.api.machines(),
            wheels: this.api.wheels(),
            rows: this.api.selectionRows().pipe(catchError(() => of<SelectionRow[]>([]))),
            limits: this.api.limits().pipe(catchError(() => of<LabLimits>({ feedCeilingsMmS: {} }))),
          }),
          this.isNew() ? of(null) : this.api.versions(this.recipeId()),
        ]),
      );
      const latest = versions?.[0] ?? null;
      this.stock.set(latest ? await this.withReferencedStock(stock, latest) : stock);
      if (latest) this.adopt(latest, true);
      else this.revalidateNow();
    } catch (e) {
      this.loadError.set(isApiError(e) ? e.generalMessage : 'The recipe could not be loaded.');
    } finally {
      this.loading.set(false);
    }
  }

  /** Archived stock a draft still references is fetched by id, so it shows by name and is checked. */
  private async withReferencedStock(stock: Stock, version: RecipeVersionDto): Promise<Stock> {
    const { scope, cutting } = version.content;
    const missing = <T extends { id: number }>(list: T[], id: number | null) => id !== null && !list.some((r) => r.id === id);
    const [material, machine, wheel] = await Promise.all([
      missing(stock.materials, scope.materialId) ? firstValueFrom(this.api.material(scope.materialId!)).catch(() => null) : null,
      missing(stock.machines, cutting.machineId) ? firstValueFrom(this.api.machine(cutting.machineId)).catch(() => null) : null,
      missing(stock.wheels, cutting.wheelId) ? firstValueFrom(this.api.wheel(cutting.wheelId)).catch(() => null) : null,
    ]);
    return {
      ...stock,
      materials: material ? [...stock.materials, material] : stock.materials,
      machines: machine ? [...stock.machines, machine] : stock.machines,
      wheels: wheel ? [...stock.wheels, wheel] : stock.wheels,
    };
  }

  /** Takes a version from the server as the new base: its revision, and (optionally) its content into the form. */
  private adopt(version: RecipeVersionDto, intoForm: boolean): void {
    this.version.set(version);
    this.baseRevision.set(version.revision);
    if (intoForm) {
      this.form.setValue({ title: version.title, content: fromContent(version.content) });
      this.savedAt.set(new Date(version.updatedAt));
    }
    this.savedSnapshot.set(snapshotOf(version));
    if (this.lockedReason()) this.form.disable({ emitEvent: false });
    this.revalidateNow();
  }

  private revalidateNow(): void {
    revalidate(this.form);
    this.valid.set(this.form.valid);
  }

  private async persist(kind: 'auto' | 'manual'): Promise<void> {
    if (this.saveState() === 'conflict' || this.lockedReason()) return;
    if (kind === 'auto' && !this.canAutosave()) return;
    if (!this.form.valid) return;
    const body = bodyOf(this.form.getRawValue());
    const sent = snapshotOf(body);
    this.saveState.set('saving');
    this.formError.set('');
    try {
      if (this.isNew()) {
        const created = await firstValueFrom(this.api.create(body, callerHandles(400)));
        this.savedSnapshot.set(sent);
        this.saveState.set('idle');
        void this.router.navigate(['/recipes', created.recipeId, 'edit'], { replaceUrl: true });
        return;
      }
      const saved = await firstValueFrom(
        this.api.save(this.recipeId(), this.version()!.version, { revision: this.baseRevision(), ...body }, callerHandles(400, 409)),
      );
      this.version.set(saved);
      this.baseRevision.set(saved.revision);
      // Only what was sent is saved; anything typed meanwhile stays "unsaved" and goes next time.
      this.savedSnapshot.set(sent);
      this.savedAt.set(new Date());
      this.saveState.set('idle');
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 409) {
        await this.resolveConflict(staleCurrent(e.body));
      } else {
        this.saveState.set('failed');
        const unmatched = e.status === 400 ? applyServerErrors(this.form, e.errors) : [];
        this.formError.set(unmatched.join(' ') || e.generalMessage);
      }
    }
  }

  /**
   * A stale save: autosave stops, the version as it is now is fetched, and the author decides
   * field by field. Then the base revision becomes the current one and the merge is saved.
   */
  private async resolveConflict(sent: RecipeVersionDto | null): Promise<void> {
    this.saveState.set('conflict');
    const current = sent ?? (await firstValueFrom(this.api.version(this.recipeId(), this.version()!.version)).catch(() => null));
    if (!current) {
      this.formError.set('The draft was changed elsewhere and its current state could not be loaded. Your input is still here; try saving again.');
      this.saveState.set('failed');
      return;
    }
    if (!EDITABLE.includes(current.status)) {
      // Submitted meanwhile: the content is frozen. Keep the author's input on screen, read-only.
      this.version.set(current);
      this.form.disable({ emitEvent: false });
      this.saveState.set('failed');
      this.formError.set('This version was submitted while you edited it, so your last changes could not be saved.');
      return;
    }
    const mine = bodyOf(this.form.getRawValue());
    const base = JSON.parse(this.savedSnapshot()) as DraftBody;
    const merged = await firstValueFrom(
      this.dialog
        .open<SaveConflictDialog, SaveConflictDialogData, DraftBody>(SaveConflictDialog, {
          data: { base, mine, theirs: current, describe: (path, value) => this.describe(path, value) },
          disableClose: true,
          width: '880px',
          maxWidth: '96vw',
          autoFocus: 'dialog',
        })
        .afterClosed(),
    );
    this.version.set(current);
    this.baseRevision.set(current.revision);
    this.savedSnapshot.set(snapshotOf(current));
    if (merged) this.form.setValue({ title: merged.title, content: fromContent(merged.content) });
    this.saveState.set('idle');
    this.revalidateNow();
    if (this.form.valid && this.dirty()) this.saves.next('manual');
  }

  /** A value as the conflict dialog shows it: names for ids, labels for choices, units for quantities. */
  private describe(path: string, value: unknown): string {
    if (value === null || value === undefined || value === '') return '—';
    const stock = this.stock();
    switch (path) {
      case 'scope.materialId':
        return stock.materials.find((m) => m.id === value)?.name ?? `Material #${value}`;
      case 'cutting.machineId':
        return stock.machines.find((m) => m.id === value)?.name ?? `Machine #${value}`;
      case 'cutting.wheelId':
        return stock.wheels.find((w) => w.id === value)?.name ?? `Wheel #${value}`;
      case 'scope.group':
        return MATERIAL_GROUP_LABELS[value as keyof typeof MATERIAL_GROUP_LABELS] ?? String(value);
      case 'scope.shape':
        return SHAPE_LABELS[value as keyof typeof SHAPE_LABELS] ?? String(value);
      case 'scope.orientation':
        return ORIENTATION_LABELS[value as keyof typeof ORIENTATION_LABELS] ?? String(value);
      case 'cutting.cutMotion':
        return CUT_MOTION_LABELS[value as keyof typeof CUT_MOTION_LABELS] ?? String(value);
      case 'clamping.method':
        return CLAMPING_METHOD_LABELS[value as keyof typeof CLAMPING_METHOD_LABELS] ?? String(value);
      case 'coolant.type':
        return COOLANT_LABELS[value as keyof typeof COOLANT_LABELS] ?? String(value);
      case 'scope.hardness': {
        const w = value as { min: number; max: number; scale: string };
        return `${w.min}–${w.max} ${w.scale}`;
      }
    }
    if (typeof value === 'boolean') return value ? 'Yes' : 'No';
    const info = FIELD_INFO[path];
    if (typeof value === 'number' && info?.kind) return formatQuantity(value, info.kind, this.units());
    if (typeof value === 'number' && info?.unit) return `${value} ${info.unit}`;
    return String(value);
  }

}

/** The version a stale-save 409 carries (`StaleSaveBody.current`), if the body has one. */
function staleCurrent(body: unknown): RecipeVersionDto | null {
  const current = (body as Partial<StaleSaveBody> | null)?.current;
  return current && typeof current === 'object' && 'revision' in current ? current : null;
}
