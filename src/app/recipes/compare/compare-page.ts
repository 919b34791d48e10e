import { Clipboard } from '@angular/cdk/clipboard';
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { RECIPE_STATUS_LABELS } from '@shared/vocabulary';
import { Notifier } from '../../core/notifier/notifier';
import { recipeVersions } from '../../core/api/recipe-versions';
import { WorkflowApi } from '../../core/api/workflow-api';
import { type ComparisonLayout, ComparisonView } from './comparison-view';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';
import { IntegrityBanner } from '../../ui/integrity-banner/integrity-banner';

/** The comparison as the URL names it; `null` until both versions are known. */
interface Pair {
  from: number;
  to: number;
}

/**
 * Compare: any two versions of one recipe. The pair and the layout live in the URL
 * (`?from=1&to=2&layout=inline`), so a copied link opens the same comparison. Without them
 * the newest version is compared with the one before it.
 */
@Component({
  selector: 'kb-compare-page',
  imports: [
    IntegrityBanner,
    ComparisonView,
    LabDatePipe,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    RouterLink,
  ],
  templateUrl: './compare-page.html',
  styleUrl: './compare-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComparePage {
  private readonly workflow = inject(WorkflowApi);
  private readonly router = inject(Router);
  private readonly clipboard = inject(Clipboard);
  private readonly notifier = inject(Notifier);
  private readonly document = inject(DOCUMENT);

  /** Route parameter `:id`. */
  readonly id = input.required<string>();
  /** Query parameters `?from=&to=&layout=`. */
  readonly from = input<string>();
  readonly to = input<string>();
  readonly layout = input<string>();

  protected readonly recipeId = computed(() => Number(this.id()));
  private readonly loaded = recipeVersions(this.recipeId);
  protected readonly state = this.loaded.state;
  /** Newest first, as the API lists them. */
  protected readonly versions = this.loaded.list;
  protected readonly newest = computed(() => this.versions()[0] ?? null);
  protected readonly shownLayout = computed<ComparisonLayout>(() => (this.layout() === 'inline' ? 'inline' : 'side-by-side'));

  /** The URL's versions when the recipe has them; otherwise the newest and the one before it. */
  protected readonly pair = computed<Pair | null>(() => {
    const list = this.versions();
    if (!list.length) return null;
    const known = (value: string | undefined) => list.find((v) => v.version === Number(value))?.version;
    const to = known(this.to()) ?? list[0].version;
    const older = list.find((v) => v.version < to)?.version;
    const from = known(this.from()) ?? older ?? to;
    return { from, to };
  });
  protected readonly sameVersion = computed(() => {
    const pair = this.pair();
    return pair !== null && pair.from === pair.to;
  });

  private readonly comparisonLoad = rxResource({
    params: computed(
      () => {
        const pair = this.pair();
        return pair && pair.from !== pair.to ? { id: this.recipeId(), ...pair } : undefined;
      },
      { equal: (a, b) => a?.id === b?.id && a?.from === b?.from && a?.to === b?.to },
    ),
    stream: ({ params }) => this.workflow.compare(params.id, params.from, params.to),
  });
  protected readonly comparing = computed(() => this.comparisonLoad.isLoading());
  /** The error interceptor has already said what went wrong. */
  protected readonly compareFailed = computed(() => !!this.comparisonLoad.error());
  protected readonly comparison = computed(() => (this.comparisonLoad.hasValue() ? this.comparisonLoad.value() : null));

  protected readonly statusLabel = (status: RecipeVersionDto['status']) => RECIPE_STATUS_LABELS[status];

  protected pickFrom(version: number): void {
    this.show({ from: version }, false);
  }

  protected pickTo(version: number): void {
    this.show({ to: version }, false);
  }

  protected swap(): void {
    const pair = this.pair();
    if (pair) this.show({ from: pair.to, to: pair.from }, false);
  }

  protected pickLayout(layout: ComparisonLayout): void {
    this.show({ layout }, true);
  }

  protected copyLink(): void {
    const link = this.document.location.origin + this.router.serializeUrl(this.urlTree({}));
    if (this.clipboard.copy(link)) {
      void this.notifier.show('Link to this comparison copied.', 'OK', 4000);
    } else {
      void this.notifier.show(`The link could not be copied. Copy it from here: ${link}`, 'OK', 15000);
    }
  }

  /** Every change writes the whole state, so the address bar always holds a complete link. */
  private show(change: Partial<Pair & { layout: ComparisonLayout }>, replaceUrl: boolean): void {
    void this.router.navigateByUrl(this.urlTree(change), { replaceUrl });
  }

  private urlTree(change: Partial<Pair & { layout: ComparisonLayout }>) {
    const pair = this.pair();
    return this.router.createUrlTree(['/recipes', this.recipeId(), 'compare'], {
      queryParams: {
        from: change.from ?? pair?.from,
        to: change.to ?? pair?.to,
        layout: change.layout ?? this.shownLayout(),
      },
    });
  }
}
