import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { cutMotionText } from '@shared/motion-settings';
import { NO_SAFETY_CLAIM } from '@shared/cautions';
import type { CheckResult, CheckSeverity } from '@shared/recipe-checks';
import { computeRecipe, type RecipeComputed } from '@shared/recipe-computations';
import type { RecipeComparison, RecipeVersionDto } from '@shared/recipe-types';
import { CLAMPING_METHOD_LABELS, COOLANT_TYPE_LABELS, MACHINE_CLASS_LABELS, MATERIAL_GROUP_LABELS, SHAPE_LABELS } from '@shared/vocabulary';
import { callerHandles } from '../../core/http/caller-handles';
import { Notifier } from '../../core/notifier/notifier';
import { Session } from '../../core/session/session';
import { CheckSeverityLabel } from '../../ui/check-severity-label';
import { recipeVersions } from '../../core/api/recipe-versions';
import { type StockNames, stockNamesOf } from '../../core/api/stock-names';
import { labLimitsWhen } from '../../core/api/lab-limits';
import { RecipeStatusChip } from '../../ui/recipe-status-chip';
import { formatMetric } from '../../ui/quantity';
import type { UnitPreference } from '@shared/api-types';
import { NO_VALUE } from '@shared/units';
import { MarkdownView } from '../../ui/markdown-view';
import { ComparisonView } from '../compare/comparison-view';
import { ReasonDialog, type ReasonDialogData } from './reason-dialog';
import { ReviewComments } from './review-comments';
import { SignatureDialog, type SignatureDialogData, type SignatureDialogResult } from './signature-dialog';
import { SignatureList } from '../../ui/signature-list';
import { WorkflowApi } from '../../core/api/workflow-api';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

const SEVERITY_ORDER: Record<CheckSeverity, number> = { blocker: 0, warning: 1, note: 2 };

/**
 * The version an approver compares against: the approved one it would replace, else the
 * version just before it; none for a first version.
 */
export function comparisonBase(versions: readonly RecipeVersionDto[], shown: RecipeVersionDto): number | null {
  const older = versions.filter((x) => x.version < shown.version).sort((a, b) => b.version - a.version);
  return (older.find((x) => x.status === 'approved') ?? older[0])?.version ?? null;
}

/**
 * Review: one submitted version with its checks (each warning acknowledged by the approver),
 * the comparison with the version it replaces, the comments, and the two ways out:
 * return with comments, or approve with an electronic signature.
 */
@Component({
  selector: 'kb-review-page',
  imports: [
    CheckSeverityLabel,
    ComparisonView,
    LabDatePipe,
    MarkdownView,
    MatButtonModule,
    MatCheckboxModule,
    MatIconModule,
    MatProgressBarModule,
    RecipeStatusChip,
    ReviewComments,
    RouterLink,
    SignatureList,
  ],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly workflow = inject(WorkflowApi);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly router = inject(Router);

  /** Route parameter `:id`. */
  readonly id = input.required<string>();
  /** Query parameter `?v=N`: the version under review; the one in review (or the newest) when absent. */
  readonly v = input<string>();

  private readonly loaded = recipeVersions(() => Number(this.id()));
  /** While the versions load again (after a refused signature) the page waits for them. */
  protected readonly state = computed(() => (this.loaded.resource.isLoading() ? 'loading' : this.loaded.state()));
  protected readonly versions = this.loaded.list;
  /** Ids of the warnings the approver has ticked; none again whenever the versions are loaded. */
  protected readonly acknowledged = linkedSignal<RecipeVersionDto[], ReadonlySet<string>>({ source: this.versions, computation: () => new Set() });

  protected readonly version = computed<RecipeVersionDto | null>(() => {
    const list = this.versions();
    const wanted = Number(this.v());
    return list.find((x) => x.version === wanted) ?? list.find((x) => x.status === 'in-review') ?? list[0] ?? null;
  });
  protected readonly baseVersion = computed(() => {
    const shown = this.version();
    return shown ? comparisonBase(this.versions(), shown) : null;
  });
  private readonly comparisonPair = computed(
    () => {
      const v = this.version();
      const from = this.baseVersion();
      return v && from !== null ? { id: v.recipeId, from, to: v.version } : undefined;
    },
    { equal: (a, b) => a?.id === b?.id && a?.from === b?.from && a?.to === b?.to },
  );
  private readonly comparisonLoad = rxResource({
    params: this.comparisonPair,
    stream: ({ params }) => this.workflow.compare(params.id, params.from, params.to),
  });
  /** The comparison with the version it replaces; null for a first version. */
  protected readonly comparison = computed<RecipeComparison | 'loading' | 'failed' | null>(() => {
    const load = this.comparisonLoad;
    if (load.status() === 'idle') return null;
    if (load.error()) return 'failed';
    return load.hasValue() ? load.value() : 'loading';
  });
  protected readonly comparisonResult = computed(() => {
    const c = this.comparison();
    return typeof c === 'object' ? c : null;
  });
  protected readonly checks = computed<CheckResult[]>(() =>
    [...(this.version()?.checks ?? [])].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]),
  );
  protected readonly warnings = computed(() => this.checks().filter((c) => c.severity === 'warning'));
  protected readonly allAcknowledged = computed(() => this.warnings().every((w) => this.acknowledged().has(w.id)));
  protected readonly inReview = computed(() => this.version()?.status === 'in-review');
  /** The signed-in approver wrote or edited this version, so they may not approve it. */
  protected readonly ownVersion = computed(() => {
    const me = this.session.user()?.id;
    const v = this.version();
    if (!v || me === undefined) return false;
    return (v.workflow?.editorIds ?? [v.createdBy.id, v.updatedBy.id]).includes(me);
  });
  protected readonly stockNames = stockNamesOf(() => this.version()?.content);
  /** The worn wheel's default share and the kerf allowance come from the lab's limits, as on the recipe page. */
  private readonly labLimits = labLimitsWhen(() => this.version() !== null);
  /** The same computed figures the recipe page shows; null until the stock and the limits are in. */
  private readonly computedFigures = computed<RecipeComputed | null>(() => {
    const v = this.version();
    const limits = this.labLimits();
    if (!v || !limits) return null;
    const { material, wheel, machine } = this.stockNames();
    // The selection table only matters to the checks, which the server has already run on this content.
    return computeRecipe(v.content, { material, wheel, machine, limits, selectionRows: [] });
  });
  protected readonly summary = computed(() => {
    const v = this.version();
    return v ? this.summarise(v, this.stockNames(), this.computedFigures()) : [];
  });
  protected readonly noSafetyClaim = NO_SAFETY_CLAIM;

  protected setAcknowledged(id: string, checked: boolean): void {
    const next = new Set(this.acknowledged());
    if (checked) next.add(id);
    else next.delete(id);
    this.acknowledged.set(next);
  }

  protected async returnWithComments(): Promise<void> {
    const v = this.version();
    if (!v) return;
    const returned = await firstValueFrom(
      this.dialog
        .open<ReasonDialog, ReasonDialogData, RecipeVersionDto>(ReasonDialog, {
          data: {
            title: `Return ${v.number} v${v.version} to its author`,
            intro: ['Say what has to change before you can approve it. The author sees this comment at the top of the recipe and in the editor.'],
            label: 'Comment for the author',
            maxLength: 4000,
            confirmLabel: 'Return to author',
            fieldPath: 'comment',
            send: (comment) => this.workflow.returnToAuthor(v.recipeId, v.version, { revision: v.revision, comment }, callerHandles(400, 409)),
          },
          width: '560px',
        })
        .afterClosed(),
    );
    if (!returned) return;
    void this.notifier.show(`${returned.number} version ${returned.version} went back to its author.`);
    void this.router.navigate(['/recipes', returned.recipeId], { queryParams: { v: returned.version } });
  }

  protected async approve(): Promise<void> {
    const v = this.version();
    if (!v || !this.allAcknowledged()) return;
    const result = await firstValueFrom(
      this.dialog
        .open<SignatureDialog, SignatureDialogData, SignatureDialogResult>(SignatureDialog, {
          data: { meaning: 'approved', version: v, acknowledgedWarnings: this.warnings().map((w) => w.id) },
          width: '600px',
          maxWidth: '95vw',
        })
        .afterClosed(),
    );
    if (result === 'reload') {
      this.loaded.resource.reload();
    } else if (result) {
      void this.notifier.show(`${result.number} version ${result.version} is approved and signed.`);
      void this.router.navigate(['/recipes', result.recipeId], { queryParams: { v: result.version } });
    }
  }

  private summarise(v: RecipeVersionDto, stock: StockNames, figures: RecipeComputed | null): { label: string; value: string }[] {
    const c = v.content;
    const units = this.session.user()?.units ?? 'metric';
    const rows = [
      { label: 'Material', value: c.scope.materialId ? (stock.material?.name ?? `Material ${c.scope.materialId}`) : 'Any material of the group' },
      { label: 'Material group', value: MATERIAL_GROUP_LABELS[c.scope.group] },
      {
        label: 'Hardness',
        value: c.scope.hardness
          ? `${c.scope.hardness.min}–${c.scope.hardness.max} ${c.scope.hardness.scale}`
          : stock.material?.hardness
            ? `${stock.material.hardness.value} ${stock.material.hardness.scale} (the material's)`
            : 'not given',
      },
      {
        label: 'Shape and size',
        value: `${SHAPE_LABELS[c.scope.shape]}, ${formatMetric(c.scope.sizeMinMm, 'mm', units)} – ${formatMetric(c.scope.sizeMaxMm, 'mm', units)}`,
      },
      {
        label: 'Machine',
        value: (stock.machine?.name ?? `Machine ${c.cutting.machineId}`) + (stock.machine ? ` (${MACHINE_CLASS_LABELS[stock.machine.machineClass]})` : ''),
      },
      {
        label: 'Wheel',
        value:
          (stock.wheel?.name ?? `Wheel ${c.cutting.wheelId}`) +
          (stock.wheel ? ` · ${stock.wheel.specification} · max ${formatMetric(stock.wheel.maxSpeedMs, 'm/s', units)}` : ''),
      },
      { label: 'Wheel speed', value: formatMetric(c.cutting.wheelRpm, 'rpm', units) },
      { label: 'Peripheral speed', value: formatMetric(figures?.peripheralSpeedMs, 'm/s', units) },
      { label: 'Margin to the marked maximum', value: speedMarginWords(figures, units) },
      { label: 'Feed', value: formatMetric(c.cutting.feedMmS, 'mm/s', units) },
      { label: 'Entry', value: entryWords(c.cutting, units) },
      // With its settings, e.g. "Pulsed plunge: advance per pulse 0.50 mm, retract per pulse 0.20 mm".
      { label: 'Cut motion', value: cutMotionText(c, units) },
      { label: 'Clamping', value: c.clamping.method ? CLAMPING_METHOD_LABELS[c.clamping.method] : 'none chosen' },
      { label: 'Clamp placement', value: c.clamping.placement.trim() || 'not given' },
      {
        label: 'Coolant',
        value:
          COOLANT_TYPE_LABELS[c.coolant.type] + (c.coolant.concentrationPct !== null ? `, ${formatMetric(c.coolant.concentrationPct, '% v/v', units)}` : ''),
      },
    ];
    return rows;
  }
}

/** "40.7 m/s (51 %) below 80.0 m/s", or how far over the wheel's marked maximum it runs. */
function speedMarginWords(figures: RecipeComputed | null, units: UnitPreference): string {
  if (!figures || figures.speedMarginMs === null || figures.speedMarginPct === null || figures.markedMaxSpeedMs === null) return NO_VALUE;
  const max = formatMetric(figures.markedMaxSpeedMs, 'm/s', units);
  const pct = Math.round(Math.abs(figures.speedMarginPct));
  return figures.speedMarginMs < 0
    ? `over ${max} by ${formatMetric(-figures.speedMarginMs, 'm/s', units)} (${pct} %)`
    : `${formatMetric(figures.speedMarginMs, 'm/s', units)} (${pct} %) below ${max}`;
}

/** The slower entry: its feed and for how far, or that there is none. */
function entryWords(cutting: RecipeVersionDto['content']['cutting'], units: UnitPreference): string {
  if (cutting.entryFeedMmS === null) return 'none: the whole cut at the feed';
  const feed = formatMetric(cutting.entryFeedMmS, 'mm/s', units);
  return cutting.entryLengthMm !== null ? `${feed} for the first ${formatMetric(cutting.entryLengthMm, 'mm', units)}` : `${feed}, length not given`;
}
