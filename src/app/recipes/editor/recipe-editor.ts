import { ChangeDetectionStrategy, Component, ElementRef, type OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatDialog } from '@angular/material/dialog';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom, merge } from 'rxjs';
import { RECIPE_STATUS_LABELS } from '@shared/vocabulary';
import { WorkflowApi } from '../../core/api/workflow-api';
import { controlMessage } from '../../core/forms/control-message';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { ConfirmDialog, type ConfirmDialogData } from '../../ui/confirm-dialog';
import { CommentsPanel } from '../review/comments-panel';
import { describeValue } from './describe-value';
import { DraftAutosave } from './draft-autosave';
import { EMPTY_STOCK, type EditorStock, loadEditorStart } from './editor-stock';
import { RecipeEditorApi } from './recipe-editor-api';
import { checksBySection, liveResults } from './live-results';
import { PhotoUploads } from './photo-uploads';
import { fieldId } from './recipe-form';
import { RecipeLivePanel } from './recipe-live-panel';
import { CautionsSection } from './sections/cautions-section';
import { ChangeReasonSection } from './sections/change-reason-section';
import { ClampingSection } from './sections/clamping-section';
import { CoolantSection } from './sections/coolant-section';
import { InstructionsSection } from './sections/instructions-section';
import { MachineWheelSection } from './sections/machine-wheel-section';
import { PhotosSection } from './sections/photos-section';
import { ScopeSection } from './sections/scope-section';
import { SpeedsSection } from './sections/speeds-section';
import type { LeavesSafely } from './unsaved-changes-guard';

/** The form's sections, in order, for the section links; `paths` say which checks each one repeats. */
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

/**
 * The recipe editor (`/recipes/new` and `/recipes/:id/edit`): the form, one component per
 * section, with the computed values and checks beside it, updated live as the author types.
 * How the draft is saved (autosave, revisions, conflicts, leaving with unsaved input) is
 * DraftAutosave's business.
 */
@Component({
  selector: 'kb-recipe-editor',
  imports: [
    CautionsSection,
    ChangeReasonSection,
    ClampingSection,
    CommentsPanel,
    CoolantSection,
    InstructionsSection,
    MachineWheelSection,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    PhotosSection,
    ReactiveFormsModule,
    RecipeLivePanel,
    RouterLink,
    ScopeSection,
    SpeedsSection,
  ],
  providers: [DraftAutosave, PhotoUploads],
  templateUrl: './recipe-editor.html',
  styleUrls: ['./sections/editor-section.scss', './recipe-editor.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
})
export class RecipeEditor implements OnInit, LeavesSafely {
  private readonly api = inject(RecipeEditorApi);
  private readonly workflow = inject(WorkflowApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly draft = inject(DraftAutosave);
  private readonly dialog = inject(MatDialog);
  /** A chosen photo not on the server yet: submitting waits for it, leaving asks. */
  protected readonly photos = inject(PhotoUploads);

  /** Route parameter: the recipe to edit; absent on /recipes/new. */
  readonly id = input<string>();

  protected readonly form = this.draft.form;
  protected readonly controls = this.form.controls.content.controls;
  protected readonly value = this.draft.value;
  protected readonly version = this.draft.version;
  protected readonly controlMessage = controlMessage;
  protected readonly sections = SECTIONS;
  protected readonly statusLabels = RECIPE_STATUS_LABELS;

  protected readonly loading = signal(true);
  protected readonly loadError = signal('');
  protected readonly stock = signal<EditorStock>(EMPTY_STOCK);
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly imperial = computed(() => this.units() === 'metric+imperial');

  protected readonly material = computed(() => this.stock().materials.find((m) => m.id === this.value().content.scope.materialId) ?? null);
  protected readonly machine = computed(() => this.stock().machines.find((m) => m.id === this.value().content.cutting.machineId) ?? null);
  protected readonly wheel = computed(() => this.stock().wheels.find((w) => w.id === this.value().content.cutting.wheelId) ?? null);

  /** Computed values and checks, recomputed a moment after the last change. */
  private readonly liveState = liveResults(this.form, this.stock, this.value);
  protected readonly computedValues = computed(() => this.liveState()?.computed ?? null);
  protected readonly checks = computed(() => this.liveState()?.checks ?? []);
  protected readonly livePending = computed(() => this.liveState()?.at !== this.value());
  protected readonly sectionChecks = computed(() => checksBySection(this.checks(), SECTIONS));

  /** Review comments of this version; the panel shows only when there are some. */
  protected readonly commentCount = signal(0);
  protected readonly submitting = signal(false);
  /** Blockers the live checks find now: while any stands the version cannot be submitted. */
  protected readonly blockers = computed(() => this.checks().filter((c) => c.severity === 'blocker'));
  protected readonly canSubmit = computed(
    () =>
      this.version()?.status === 'draft' &&
      !this.draft.lockedReason() &&
      !this.draft.dirty() &&
      this.draft.saveState() === 'idle' &&
      !this.livePending() &&
      !this.photos.pending() &&
      this.blockers().length === 0,
  );

  constructor() {
    this.draft.describe = (path, value) => describeValue(path, value, this.stock(), this.units());
    // In "one material" mode the material brings its group.
    const scope = this.controls.scope.controls;
    merge(scope.materialId.valueChanges, scope.by.valueChanges)
      .pipe(takeUntilDestroyed())
      .subscribe(() => {
        const material = this.stock().materials.find((m) => m.id === scope.materialId.value);
        if (material && scope.by.value === 'material' && scope.group.value !== material.group) scope.group.setValue(material.group);
      });
  }

  ngOnInit(): void {
    void this.load();
  }

  /** CanDeactivate: ask before unsaved input or a chosen photo is thrown away. */
  async canLeave(): Promise<boolean> {
    const photo = this.photos.pending();
    if (photo) {
      const leave = await firstValueFrom(
        this.dialog
          .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
            data: {
              title: 'Leave without the photo?',
              message: [photo, 'If you leave now, the photo is not added to the recipe.'],
              confirmLabel: 'Leave without the photo',
            },
          })
          .afterClosed(),
      );
      if (leave !== true) return false;
    }
    return this.draft.canLeave();
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.draft.unsaved() || this.photos.pending()) event.preventDefault();
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
    this.form.controls.content.get(parts)?.markAsTouched();
    target.scrollIntoView?.({ behavior: 'smooth', block: 'center' });
    const focusable = target.matches('input, textarea, mat-select, [tabindex]')
      ? target
      : target.querySelector<HTMLElement>('input, textarea, mat-select, [tabindex]:not([tabindex="-1"])');
    (focusable ?? target).focus({ preventScroll: true });
  }

  protected saveNow(): void {
    if (this.draft.saveNow()) return;
    const first = this.host.nativeElement.querySelector<HTMLElement>('.ng-invalid[id^="f-"], .ng-invalid [id^="f-"]');
    if (first?.id) this.goToField(first.id.slice(2).replaceAll('-', '.'));
  }

  /** Sends the saved draft for review, with the revision it was saved at; then shows it on the recipe page. */
  protected async submitForReview(): Promise<void> {
    const v = this.version();
    if (!v || !this.canSubmit()) return;
    this.draft.formError.set('');
    this.submitting.set(true);
    try {
      const submitted = await firstValueFrom(this.workflow.submit(v.recipeId, v.version, { revision: this.draft.revision() }, callerHandles(409)));
      this.draft.adopt(submitted, false);
      void this.notifier.show(`${submitted.number} version ${submitted.version} is waiting for review.`);
      void this.router.navigate(['/recipes', submitted.recipeId]);
    } catch (e) {
      if (!isApiError(e)) throw e;
      this.draft.formError.set(
        e.code === 'BLOCKERS'
          ? `Not submitted; the server found blockers: ${e.errors.map((x) => x.message).join(' ')}`
          : 'Not submitted: this draft changed since it was loaded. Reload the page to see the current content.',
      );
    } finally {
      this.submitting.set(false);
    }
  }

  private async load(): Promise<void> {
    this.loading.set(true);
    try {
      const { stock, latest } = await loadEditorStart(this.api, this.id() ? Number(this.id()) : null);
      this.stock.set(stock);
      if (latest) this.draft.adopt(latest, true);
      else this.draft.revalidateNow();
    } catch (e) {
      this.loadError.set(isApiError(e) ? e.generalMessage : 'The recipe could not be loaded.');
    } finally {
      this.loading.set(false);
    }
  }
}
