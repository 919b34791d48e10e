import { ChangeDetectionStrategy, Component, computed, effect, inject, untracked } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, map, merge, of } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { RecipeSummary } from '@shared/recipe-types';
import { hasAccess } from '@shared/roles';
import { RECIPE_SORT_FIELDS } from '@shared/schemas/recipe';
import type { MachineRecord } from '@shared/stock-types';
import {
  HARDNESS_SCALES,
  type HardnessScale,
  MATERIAL_GROUPS,
  MATERIAL_GROUP_LABELS,
  type MaterialGroup,
  RECIPE_STATUSES,
  RECIPE_STATUS_LABELS,
  REVIEW_OVERDUE_LABEL,
  type RecipeStatus,
  SHAPES,
  SHAPE_LABELS,
  type Shape,
} from '@shared/vocabulary';
import { latestValue } from '../../core/api/latest-value';
import { Session } from '../../core/session/session';
import { CheckSeverityLabel } from '../../ui/check-severity-label';
import { RecipeApi } from '../../core/api/recipe-api';
import { RecipeStatusChip } from '../../ui/recipe-status-chip';
import { ReviewOverdueChip } from '../../ui/review-overdue-chip';
import { PagedTable } from '../../ui/paged-table';
import { QuantityPipe } from '../../ui/quantity';
import { StockApi } from '../../core/api/stock-api';
import {
  LIBRARY_PAGE_SIZES,
  type LibraryParams,
  type LibrarySortField,
  hardnessInHv,
  readLibraryParams,
  toLibraryQueryParams,
  toRecipeListQuery,
} from './library-params';
import { controlMessage } from '../../core/forms/control-message';
import { DecimalInput } from '../../ui/decimal-input';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

/** How long the text filters wait for typing to pause before the view changes. */
export const LIBRARY_TYPING_DEBOUNCE_MS = 300;

/** Library: every recipe, searched, filtered, sorted and paged by the server; the view lives in the URL. */
@Component({
  selector: 'kb-library',
  imports: [
    DecimalInput,
    CheckSeverityLabel,
    LabDatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    PagedTable,
    QuantityPipe,
    ReactiveFormsModule,
    RecipeStatusChip,
    ReviewOverdueChip,
    RouterLink,
  ],
  templateUrl: './library.html',
  styleUrl: './library.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Library {
  private readonly api = inject(RecipeApi);
  private readonly stock = inject(StockApi);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The view, read from the URL: the one source of truth for filters, order and page. */
  protected readonly params = toSignal(this.route.queryParamMap.pipe(map(readLibraryParams)), {
    initialValue: readLibraryParams(this.route.snapshot.queryParamMap),
  });

  protected readonly columns = ['number', 'title', 'size', 'machine', 'wheel', 'version', 'status', 'reviewDue', 'worstCheck', 'updatedAt'];
  protected readonly overdueLabel = REVIEW_OVERDUE_LABEL;
  protected readonly pageSizeOptions = LIBRARY_PAGE_SIZES;
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly shapes = SHAPES.map((id) => ({ id, label: SHAPE_LABELS[id] }));
  protected readonly statuses = RECIPE_STATUSES.map((id) => ({ id, label: RECIPE_STATUS_LABELS[id] }));
  protected readonly scales = HARDNESS_SCALES;
  protected readonly groupLabel = (group: MaterialGroup) => MATERIAL_GROUP_LABELS[group];
  protected readonly shapeLabel = (shape: Shape) => SHAPE_LABELS[shape];
  protected readonly canCreate = computed(() => hasAccess(this.session.roles(), ['author']));
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');

  protected readonly controlMessage = controlMessage;
  protected readonly filters = this.fb.group({
    q: [this.params().q],
    group: this.fb.control<MaterialGroup | ''>(this.params().group),
    shape: this.fb.control<Shape | ''>(this.params().shape),
    machineId: this.fb.control<number | null>(this.params().machineId),
    status: this.fb.control<RecipeStatus | ''>(this.params().status),
    review: this.fb.control<'overdue' | ''>(this.params().review),
    size: this.fb.control<number | null>(this.params().size),
    hardness: this.fb.control<number | null>(this.params().hardness),
    scale: this.fb.control<HardnessScale>(this.params().scale),
  });

  protected readonly machines = toSignal(
    this.stock.machines.list({ pageSize: 200, archived: 'all', sort: 'name' }).pipe(
      map((page) => page.items),
      catchError(() => of([] as MachineRecord[])),
    ),
    { initialValue: [] as MachineRecord[] },
  );

  /** What the hardness filter means in HV, or why it is not applied. */
  protected readonly hardnessNote = computed(() => {
    const p = this.params();
    if (p.hardness === null) return '';
    if (p.scale === 'HV') return '';
    const hv = hardnessInHv(p);
    return hv === undefined
      ? `No HV value for ${p.hardness} ${p.scale} in the steel conversion table: hardness is not filtered.`
      : `≈ ${hv} HV (steel conversion, ASTM E140)`;
  });
  protected readonly hasFilters = computed(() => {
    const p = this.params();
    return !!(p.q || p.group || p.shape || p.machineId || p.status || p.review || p.size || p.hardness);
  });

  private readonly list = rxResource({ params: () => toRecipeListQuery(this.params()), stream: ({ params }) => this.api.list(params) });
  protected readonly loading = computed(() => this.list.isLoading());
  /** The error interceptor has already told the user what went wrong; the last rows stay. */
  protected readonly loadFailed = computed(() => !!this.list.error());
  protected readonly result = latestValue<Page<RecipeSummary>>(this.list, { items: [], total: 0, page: 0, pageSize: 25 });

  constructor() {
    // Typing waits for a pause; choosing from a list applies at once.
    const c = this.filters.controls;
    merge(
      merge(c.q.valueChanges, c.size.valueChanges, c.hardness.valueChanges).pipe(debounceTime(LIBRARY_TYPING_DEBOUNCE_MS)),
      merge(c.group.valueChanges, c.shape.valueChanges, c.machineId.valueChanges, c.status.valueChanges, c.scale.valueChanges, c.review.valueChanges),
    )
      .pipe(takeUntilDestroyed())
      .subscribe(() => this.applyFilters());

    // Back / forward or a pasted link: show the URL's filters in the fields.
    effect(() => {
      const p = this.params();
      untracked(() => this.showInFields(p));
    });
  }

  protected changeSort(sort: Sort): void {
    const field = RECIPE_SORT_FIELDS.find((f) => f === sort.active);
    const active: LibrarySortField = field && sort.direction ? field : 'number';
    this.navigate({ ...this.params(), sort: active, dir: sort.direction === 'desc' ? 'desc' : 'asc', page: 0 }, false);
  }

  protected changePage(event: PageEvent): void {
    const p = this.params();
    if (event.pageSize !== p.pageSize) this.navigate({ ...p, pageSize: event.pageSize, page: 0 }, false);
    else this.navigate({ ...p, page: event.pageIndex }, false);
  }

  protected clearSearch(): void {
    this.filters.controls.q.setValue('');
  }

  protected clearFilters(): void {
    this.navigate({ ...this.params(), q: '', group: '', shape: '', machineId: null, status: '', review: '', size: null, hardness: null, page: 0 }, false);
  }

  protected openRecipe(recipe: RecipeSummary): void {
    void this.router.navigate(['/recipes', recipe.id]);
  }

  private applyFilters(): void {
    const f = this.filters.getRawValue();
    const p = this.params();
    const next: LibraryParams = {
      ...p,
      q: f.q.trim(),
      group: f.group,
      shape: f.shape,
      machineId: f.machineId,
      status: f.status,
      review: f.review,
      size: f.size !== null && f.size > 0 ? f.size : null,
      hardness: f.hardness !== null && f.hardness > 0 ? f.hardness : null,
      scale: f.scale,
    };
    const filtersOf = (v: LibraryParams) => JSON.stringify({ ...v, page: 0, sort: '', dir: '', pageSize: 0 });
    if (filtersOf(next) === filtersOf(p)) return;
    this.navigate({ ...next, page: 0 }, true);
  }

  private navigate(next: LibraryParams, replaceUrl: boolean): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: toLibraryQueryParams(next), replaceUrl });
  }

  private showInFields(p: LibraryParams): void {
    const c = this.filters.controls;
    const quiet = { emitEvent: false };
    if (c.q.value.trim() !== p.q) c.q.setValue(p.q, quiet);
    if (c.group.value !== p.group) c.group.setValue(p.group, quiet);
    if (c.shape.value !== p.shape) c.shape.setValue(p.shape, quiet);
    if (c.machineId.value !== p.machineId) c.machineId.setValue(p.machineId, quiet);
    if (c.status.value !== p.status) c.status.setValue(p.status, quiet);
    if (c.review.value !== p.review) c.review.setValue(p.review, quiet);
    if ((c.size.value || null) !== p.size) c.size.setValue(p.size, quiet);
    if ((c.hardness.value || null) !== p.hardness) c.hardness.setValue(p.hardness, quiet);
    if (c.scale.value !== p.scale) c.scale.setValue(p.scale, quiet);
  }
}
