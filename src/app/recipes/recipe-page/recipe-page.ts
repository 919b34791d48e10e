import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTabsModule } from '@angular/material/tabs';
import { Router, RouterLink } from '@angular/router';
import { EMPTY, catchError, distinctUntilChanged, firstValueFrom, switchMap } from 'rxjs';
import { motionSettingRows, motionSettingsMissing } from '@shared/motion-settings';
import { NO_SAFETY_CLAIM, recipeCautions } from '@shared/cautions';
import type { CheckResult, CheckSeverity } from '@shared/recipe-checks';
import { computeRecipe } from '@shared/recipe-computations';
import type { CutRecordDto, MyAcknowledgementDto, RecipeVersionDto } from '@shared/recipe-types';
import { hasAccess } from '@shared/roles';
import {
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPE_LABELS,
  CUT_MOTION_LABELS,
  CUT_ORIENTATION_LABELS,
  MACHINE_CLASS_LABELS,
  MATERIAL_GROUP_LABELS,
  RECIPE_STATUS_LABELS,
  SHAPE_LABELS,
  WHEEL_KIND_LABELS,
  WHEEL_RESTRICTION_LABELS,
  type WheelRestriction,
  WHEEL_PATH_LABELS,
} from '@shared/vocabulary';
import { askToAcknowledge } from '../../ui/acknowledge-dialog';
import { mustAcknowledge } from '../../ui/acknowledgement-state';
import { NotForUseBanner } from './not-for-use-banner';
import { IntegrityBanner } from '../../ui/integrity-banner/integrity-banner';
import { AcknowledgementsPanel } from '../acknowledge/acknowledgements-panel';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { CutProfilePlot } from '../../ui/cut-profile-plot/cut-profile-plot';
import { capacityWords } from '../../ui/cutting-geometry/capacity-words';
import { WornWheelValues } from '../../ui/cutting-geometry/worn-wheel-values';
import { MarkedMaximumPipe } from '../../ui/marked-maximum';
import { QuantityPipe } from '../../ui/quantity';
import { recipeVersions } from '../../core/api/recipe-versions';
import { stockNamesOf } from '../../core/api/stock-names';
import { labLimitsWhen } from '../../core/api/lab-limits';
import { CommentsPanel } from '../review/comments-panel';
import { ReasonDialog, type ReasonDialogData } from '../review/reason-dialog';
import { ReviewComments } from '../review/review-comments';
import { SignatureDialog, type SignatureDialogData, type SignatureDialogResult } from '../review/signature-dialog';
import { SignatureList } from '../../ui/signature-list';
import { utcToday } from '../../core/dates/calendar';
import { isReviewOverdue } from '@shared/review-due';
import { ReviewOverdueChip } from '../../ui/review-overdue-chip';
import { WorkflowApi } from '../../core/api/workflow-api';
import { MarkdownView } from '../../ui/markdown-view';
import { LogCutDialog, type LogCutDialogData } from '../../ui/log-cut-dialog/log-cut-dialog';
import { RecipeCuts } from '../cuts/recipe-cuts';
import { benchSheetUrl } from '../../core/api/bench-sheet';
import { CheckSeverityLabel } from '../../ui/check-severity-label';
import { RecipeApi } from '../../core/api/recipe-api';
import { RecipeCutPower } from './recipe-cut-power';
import { RecipeHistory } from './recipe-history';
import { RecipeStatusChip } from '../../ui/recipe-status-chip';
import { StandardCautions } from './standard-cautions';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

const SEVERITY_ORDER: Record<CheckSeverity, number> = { blocker: 0, warning: 1, note: 2 };
const OPEN_STATUSES: readonly RecipeVersionDto['status'][] = ['draft', 'in-review', 'returned'];

const ATTACHMENT_ROLE_LABELS = { setup: 'Setup', 'good-face': 'Good cut face', 'bad-face': 'Bad cut face', other: 'Other' } as const;

/** Recipe: one version of a recipe, read-only, with its computed values, checks, instructions and photos. */
@Component({
  selector: 'kb-recipe-page',
  imports: [
    ReviewOverdueChip,
    AcknowledgementsPanel,
    CheckSeverityLabel,
    CommentsPanel,
    CutProfilePlot,
    LabDatePipe,
    DecimalPipe,
    MarkdownView,
    MarkedMaximumPipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTabsModule,
    NotForUseBanner,
    IntegrityBanner,
    QuantityPipe,
    RecipeCutPower,
    RecipeCuts,
    RecipeHistory,
    RecipeStatusChip,
    ReviewComments,
    RouterLink,
    SignatureList,
    StandardCautions,
    WornWheelValues,
  ],
  templateUrl: './recipe-page.html',
  styleUrl: './recipe-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipePage {
  private readonly api = inject(RecipeApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly workflow = inject(WorkflowApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  /** Route parameter `:id` (numeric, see numericIdParam). */
  readonly id = input.required<string>();
  /** Query parameter `?v=N`: the version to show; the newest when absent. */
  readonly v = input<string>();
  /** Query parameter `?tab=cuts`: open on the Cuts tab (from Today's flagged cuts). */
  readonly tab = input<string>();

  private readonly loaded = recipeVersions(() => Number(this.id()));
  protected readonly state = this.loaded.state;
  /**
   * The operator's own acknowledgement of a version ("recipeId/version" → it), which the list
   * does not carry; laid over the list.
   */
  private readonly myAcknowledgements = signal<ReadonlyMap<string, MyAcknowledgementDto | null>>(new Map());
  /** Newest first, as the API lists them. */
  protected readonly versions = computed<RecipeVersionDto[]>(() => {
    const mine = this.myAcknowledgements();
    return this.loaded.list().map((x) => {
      const key = `${x.recipeId}/${x.version}`;
      return mine.has(key) ? { ...x, myAcknowledgement: mine.get(key) } : x;
    });
  });
  protected readonly busy = signal(false);
  /** Why the last submit was refused (blockers found by the server, or a changed version). */
  protected readonly submitError = signal<string[]>([]);

  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly version = computed<RecipeVersionDto | null>(() => {
    const list = this.versions();
    const wanted = Number(this.v());
    const asked = list.find((x) => x.version === wanted);
    if (asked) return asked;
    // Sent to the Cuts tab without a version (Today's flagged cuts): the version in force takes the cuts.
    if (this.tab() === 'cuts') {
      const inForce = list.find((x) => x.status === 'approved' && (x.workflow?.effectiveFrom ?? '') <= this.today);
      if (inForce) return inForce;
    }
    return list[0] ?? null;
  });
  protected readonly isLatest = computed(() => this.version() !== null && this.version() === this.versions()[0]);
  protected readonly canEditDraft = computed(() => {
    const status = this.version()?.status;
    return hasAccess(this.session.roles(), ['author']) && this.isLatest() && (status === 'draft' || status === 'returned');
  });
  private readonly isAuthor = computed(() => hasAccess(this.session.roles(), ['author']));
  private readonly isApprover = computed(() => hasAccess(this.session.roles(), ['approver']));
  /** A version still on its way (draft, in review or returned): a new one cannot be started beside it. */
  private readonly openVersion = computed(() => this.versions().find((x) => OPEN_STATUSES.includes(x.status)) ?? null);
  /** Only drafts go to review: a returned version becomes a draft again when its author edits it. */
  protected readonly canSubmit = computed(() => this.isAuthor() && this.isLatest() && this.version()?.status === 'draft');
  protected readonly blockers = computed(() => this.checks().filter((c) => c.severity === 'blocker'));
  protected readonly canStartNewVersion = computed(() => {
    const status = this.version()?.status;
    return this.isAuthor() && !this.openVersion() && (status === 'approved' || status === 'superseded' || status === 'withdrawn');
  });
  protected readonly canReview = computed(() => this.isApprover() && this.version()?.status === 'in-review');
  protected readonly canWithdraw = computed(() => this.isApprover() && this.version()?.status === 'approved');
  /** Returned versions put the approver's comments in front of the author. */
  protected readonly commentsUpFront = computed(() => this.version()?.status === 'returned');
  protected readonly canComment = computed(() => {
    const status = this.version()?.status;
    return hasAccess(this.session.roles(), ['author', 'approver']) && (status === 'in-review' || status === 'returned' || status === 'draft');
  });

  /** Approved versions (current or not yet effective) have a bench sheet; the server records every print. */
  protected readonly sheetUrl = computed(() => {
    const v = this.version();
    return v && v.status === 'approved' ? benchSheetUrl(v.recipeId, v.version) : null;
  });
  /** Approved and in force today: the only version that takes cuts. */
  protected readonly isCurrent = computed(() => {
    const v = this.version();
    if (v?.status !== 'approved') return false;
    const from = v.workflow?.effectiveFrom;
    return !from || from <= this.today;
  });
  /** The version in force is past its periodic review date: marked, never blocked. */
  protected readonly reviewOverdue = computed(() => this.isCurrent() && isReviewOverdue(this.version()?.workflow?.reviewDueOn, this.today));
  protected readonly canLogCut = computed(() => this.isCurrent() && hasAccess(this.session.roles(), ['operator']));
  /** A new version of the operator's machine's recipe: read and understood before its sheet opens. */
  protected readonly mustAcknowledge = computed(() => hasAccess(this.session.roles(), ['operator']) && mustAcknowledge(this.version()));
  /** Who has acknowledged an approved version, for those who answer for the recipe or check it. */
  protected readonly canSeeAcknowledgements = computed(
    () => this.version()?.status === 'approved' && hasAccess(this.session.roles(), ['author', 'approver', 'auditor', 'admin']),
  );
  protected readonly canClearFlags = computed(() => this.isAuthor());
  /** Bumped after a cut is logged, so the Cuts tab fetches its list again. */
  protected readonly cutsReload = signal(0);
  /** Index of the Cuts tab, the last one; the Comments tab is left out while comments sit above the tabs. */
  protected readonly initialTab = computed(() => (this.tab() === 'cuts' ? (this.commentsUpFront() ? 6 : 7) : 0));

  protected readonly stockNames = stockNamesOf(() => this.version()?.content);

  /** The worn wheel's default share and the kerf allowance come from the lab's limits (the checks come from the server). */
  private readonly labLimits = labLimitsWhen(() => this.version() !== null);

  protected readonly computed = computed(() => {
    const version = this.version();
    const limits = this.labLimits();
    if (!version || !limits) return null;
    const { material, wheel, machine } = this.stockNames();
    // The selection table only matters to the checks, which the server has already run on this content.
    return computeRecipe(version.content, { material, wheel, machine, limits, selectionRows: [] });
  });
  /** The capacity in words, with the geometric limit that applies. */
  protected readonly capacity = computed(() => capacityWords(this.computed(), this.units()));
  /** The cut motion's settings, one row each; older content has none. */
  protected readonly motionRows = computed(() => {
    const c = this.version()?.content;
    return c ? motionSettingRows(c, this.units()) : [];
  });
  protected readonly motionNotGiven = computed(() => {
    const c = this.version()?.content;
    return c ? motionSettingsMissing(c) : false;
  });

  /** The cautions this version's material, coolant or flags call for, beside the standard ones. */
  protected readonly recipeCautions = computed(() => {
    const version = this.version();
    return version ? recipeCautions(version.content, { material: this.stockNames().material }) : [];
  });
  protected readonly checks = computed<CheckResult[]>(() =>
    [...(this.version()?.checks ?? [])].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]),
  );
  protected readonly checkCounts = computed(() => {
    const counts = { blocker: 0, warning: 0, note: 0 };
    for (const check of this.checks()) counts[check.severity]++;
    return counts;
  });

  protected readonly statusLabel = (status: RecipeVersionDto['status']) => RECIPE_STATUS_LABELS[status];
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly shapeLabel = SHAPE_LABELS;
  protected readonly motionLabel = CUT_MOTION_LABELS;
  protected readonly clampingLabel = CLAMPING_METHOD_LABELS;
  protected readonly machineClassLabel = MACHINE_CLASS_LABELS;
  protected readonly wheelKindLabel = WHEEL_KIND_LABELS;
  protected readonly coolantLabel = COOLANT_TYPE_LABELS;
  protected readonly wheelPathLabel = WHEEL_PATH_LABELS;
  protected readonly orientationLabel = CUT_ORIENTATION_LABELS;
  protected readonly attachmentRoleLabel = ATTACHMENT_ROLE_LABELS;
  protected readonly restrictionsText = (marks: readonly WheelRestriction[]) =>
    marks.length ? marks.map((r) => WHEEL_RESTRICTION_LABELS[r]).join('; ') : 'None marked';
  protected readonly noSafetyClaim = NO_SAFETY_CLAIM;
  /** YYYY-MM-DD (UTC), to tell an approved version that is not yet current. */
  protected readonly today = utcToday();

  constructor() {
    // The versions list does not say whether this operator must still acknowledge the shown
    // version; the single version does. Asked for approved versions only, once each.
    toObservable(
      computed(() => {
        const v = this.version();
        const ask = v && v.status === 'approved' && v.myAcknowledgement === undefined && hasAccess(this.session.roles(), ['operator']);
        return ask ? `${v.recipeId}/${v.version}` : null;
      }),
    )
      .pipe(
        distinctUntilChanged(),
        switchMap((key) => {
          if (!key) return EMPTY;
          const [recipeId, version] = key.split('/').map(Number);
          // On failure the sheet link stays as it is; the server still refuses an unacknowledged print.
          return this.api.version(recipeId, version).pipe(catchError(() => EMPTY));
        }),
        takeUntilDestroyed(),
      )
      .subscribe((fresh) => this.setMyAcknowledgement(fresh, fresh.myAcknowledgement ?? null));
  }

  protected showVersion(version: number): void {
    const newest = this.versions()[0]?.version;
    void this.router.navigate(['/recipes', this.id()], { queryParams: version === newest ? {} : { v: version } });
  }

  protected async submitForReview(): Promise<void> {
    const v = this.version();
    if (!v || this.blockers().length) return;
    this.submitError.set([]);
    this.busy.set(true);
    try {
      const submitted = await firstValueFrom(this.workflow.submit(v.recipeId, v.version, { revision: v.revision }, callerHandles(409)));
      this.replace(submitted);
      void this.notifier.show(`${submitted.number} version ${submitted.version} is waiting for review.`);
    } catch (e) {
      if (!isApiError(e)) throw e;
      this.submitError.set(
        e.code === 'BLOCKERS'
          ? ['The server found blockers; fix them in the editor and submit again:', ...e.errors.map((x) => x.message)]
          : ['This version changed since you opened it; reload to see the current content.'],
      );
    } finally {
      this.busy.set(false);
    }
  }

  protected async startNewVersion(): Promise<void> {
    const v = this.version();
    if (!v) return;
    const created = await firstValueFrom(
      this.dialog
        .open<ReasonDialog, ReasonDialogData, RecipeVersionDto>(ReasonDialog, {
          data: {
            title: `Start version ${this.versions()[0].version + 1} of ${v.number}`,
            intro: [`The new draft starts as a copy of version ${v.version}. Version ${v.version} stays as it is until the new one is approved.`],
            label: 'Change reason',
            maxLength: 1000,
            confirmLabel: 'Start the new version',
            fieldPath: 'changeReason',
            send: (changeReason) => this.workflow.newVersion(v.recipeId, { fromVersion: v.version, changeReason }, callerHandles(400, 409)),
          },
          width: '560px',
        })
        .afterClosed(),
    );
    if (created) void this.router.navigate(['/recipes', created.recipeId, 'edit']);
  }

  protected async withdraw(): Promise<void> {
    const v = this.version();
    if (!v) return;
    const result = await firstValueFrom(
      this.dialog
        .open<SignatureDialog, SignatureDialogData, SignatureDialogResult>(SignatureDialog, {
          data: { meaning: 'withdrawn', version: v },
          width: '600px',
          maxWidth: '95vw',
        })
        .afterClosed(),
    );
    if (result === 'reload') {
      this.loaded.resource.reload();
    } else if (result) {
      this.replace(result);
      void this.notifier.show(`${result.number} version ${result.version} is withdrawn.`);
    }
  }

  /** The print gate: the dialog records the acknowledgement and opens the sheet. */
  protected async acknowledgeAndPrint(): Promise<void> {
    const v = this.version();
    if (!v) return;
    const mine = await askToAcknowledge(this.dialog, { recipeId: v.recipeId, number: v.number, title: v.title, version: v.version });
    if (!mine) return;
    this.setMyAcknowledgement(v, mine);
    void this.notifier.show(`${v.number} version ${v.version} acknowledged.`);
  }

  private setMyAcknowledgement(version: Pick<RecipeVersionDto, 'recipeId' | 'version'>, mine: MyAcknowledgementDto | null): void {
    this.myAcknowledgements.update((known) => new Map(known).set(`${version.recipeId}/${version.version}`, mine));
  }

  protected async logCut(): Promise<void> {
    const v = this.version();
    if (!v) return;
    const saved = await firstValueFrom(
      this.dialog
        .open<LogCutDialog, LogCutDialogData, CutRecordDto>(LogCutDialog, {
          data: { recipeId: v.recipeId, number: v.number, title: v.title, version: v.version, mustAcknowledge: this.mustAcknowledge() },
          width: '600px',
          maxWidth: '95vw',
          autoFocus: 'first-tabbable',
        })
        .afterClosed(),
    );
    if (!saved) return;
    this.cutsReload.update((n) => n + 1);
    void this.notifier.show(
      saved.outcome === 'good'
        ? `Cut of specimen ${saved.specimenId} logged.`
        : `Cut of specimen ${saved.specimenId} logged and flagged; the author of ${saved.number} will be told.`,
    );
  }

  protected reload(): void {
    this.submitError.set([]);
    this.loaded.resource.reload();
  }

  /** Puts the server's answer in place of the version it updates, and fetches the rest again (a step can change other versions). */
  private replace(updated: RecipeVersionDto): void {
    this.loaded.resource.update((list) => list?.map((x) => (x.version === updated.version ? updated : x)));
    this.loaded.resource.reload();
  }
}
