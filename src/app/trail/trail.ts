import { ChangeDetectionStrategy, Component, type ElementRef, computed, effect, inject, linkedSignal, signal, untracked, viewChild } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router } from '@angular/router';
import { type Observable, catchError, debounceTime, map, merge, of, switchMap } from 'rxjs';
import type { PersonNameDto, TrailPage, ChainVerification } from '@shared/recipe-types';
import { TRAIL_EVENT_LABELS, TRAIL_FAMILIES, TRAIL_FAMILY_LABELS, type TrailFamily, trailEventLabel } from '@shared/vocabulary';
import { latestValue } from '../core/api/latest-value';
import { LabDateFormat } from '../core/dates/lab-date-format';
import { RecipeApi } from '../core/api/recipe-api';
import { type ChangeSummary, fullJson, summariseChange } from './event-change';
import { TrailApi } from './trail-api';
import { TRAIL_DEFAULTS, TRAIL_PAGE_SIZE, type TrailParams, readTrailParams, recipeIdOf, toTrailFilters, toTrailQueryParams } from './trail-params';
import { trailTime } from './trail-time';

/** How long the typed filters wait for a pause before the list changes. */
export const TRAIL_TYPING_DEBOUNCE_MS = 400;

/** Event types offered while typing (by code or by words); any other type can still be typed in full. */
const SUGGESTED_TYPES = Object.keys(TRAIL_EVENT_LABELS);

/** A trail row with what the table shows already worked out. */
interface EventRow {
  event: TrailPage['items'][number];
  /** The event type in words; the stored code goes in a tooltip. */
  label: string;
  time: string;
  change: ChangeSummary;
}

/** How the recipe filter turned out: no filter, an id to send, or a number the library does not know. */
type RecipeFilter = { state: 'none' } | { state: 'id'; id: number; number: string | null } | { state: 'unknown'; reference: string } | { state: 'failed' };

const EMPTY_PAGE: TrailPage = { items: [], nextBefore: null };

/** What the list shows: the recipe filter as it resolved, the page, and whether the page failed to load. */
interface TrailLoad {
  recipe: RecipeFilter;
  page: TrailPage;
  failed: boolean;
}

/**
 * Trail (auditor, admin): the audit events, newest first, filtered and paged by keyset on the
 * server; the view lives in the URL. Verifies the hash chain and exports the same filters as CSV.
 */
@Component({
  selector: 'kb-trail',
  imports: [
    MatAutocompleteModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatTableModule,
    MatTooltipModule,
    ReactiveFormsModule,
  ],
  templateUrl: './trail.html',
  styleUrl: './trail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Trail {
  private readonly api = inject(TrailApi);
  private readonly dates = inject(LabDateFormat);
  private readonly recipes = inject(RecipeApi);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The view, read from the URL: the one source of truth for filters and the keyset position. */
  protected readonly params = toSignal(this.route.queryParamMap.pipe(map(readTrailParams)), {
    initialValue: readTrailParams(this.route.snapshot.queryParamMap),
  });

  private readonly tableTop = viewChild<ElementRef<HTMLElement>>('tableTop');

  protected readonly columns = ['occurredAt', 'actor', 'type', 'what', 'change', 'detail'];
  protected readonly families = TRAIL_FAMILIES.map((id) => ({ id, label: TRAIL_FAMILY_LABELS[id] }));
  protected readonly eventLabel = trailEventLabel;

  protected readonly filters = this.fb.group({
    recipe: [this.params().recipe],
    userId: this.fb.control<number | null>(this.params().userId),
    type: [this.params().type],
    family: this.fb.control<TrailFamily | ''>(this.params().family),
    hideSignIns: [this.params().hideSignIns],
    from: [this.params().from],
    to: [this.params().to],
  });

  /** Everyone the trail can name, by name (auditors and admins alike). */
  private readonly peopleList = rxResource({ stream: () => this.api.people().pipe(catchError(() => of<PersonNameDto[]>([]))) });
  protected readonly people = computed<PersonNameDto[]>(() => (this.peopleList.hasValue() ? this.peopleList.value() : []));

  /** The page the URL asks for, with the recipe filter it was read with. */
  private readonly events = rxResource({ params: () => this.params(), stream: ({ params }) => this.loadEvents(params) });
  private readonly shown = latestValue(this.events, { recipe: { state: 'none' }, page: EMPTY_PAGE, failed: false } as TrailLoad);
  protected readonly loading = computed(() => this.events.isLoading());
  protected readonly loadFailed = computed(() => this.shown().failed);
  protected readonly page = computed(() => this.shown().page);
  protected readonly recipeFilter = computed(() => this.shown().recipe);
  /** Events opened to show their change in full; none again on every new page. */
  protected readonly expanded = linkedSignal<TrailPage, ReadonlySet<number>>({ source: this.page, computation: () => new Set() });
  protected readonly verifying = signal(false);
  protected readonly verification = signal<ChainVerification | null>(null);
  protected readonly verifyFailed = signal(false);

  protected readonly rows = computed<EventRow[]>(() => {
    const format = this.dates.format();
    return this.page().items.map((event) => ({
      event,
      label: trailEventLabel(event.type),
      time: trailTime(event.occurredAt, format),
      change: summariseChange(event.before, event.after),
    }));
  });
  protected readonly hasFilters = computed(() => {
    const p = this.params();
    return !!(p.recipe || p.userId || p.type || p.family || p.hideSignIns || p.from || p.to);
  });
  /** The same filters as a CSV download (every matching row, so no keyset position). */
  protected readonly csvUrl = computed(() => {
    const filter = this.recipeFilter();
    return this.api.csvUrl(toTrailFilters(this.params(), filter.state === 'id' ? filter.id : null));
  });
  /** The suggested types and every type seen on a page so far. */
  private readonly seenTypes = linkedSignal<TrailPage, ReadonlySet<string>>({
    source: this.page,
    computation: (page, previous) => new Set([...(previous?.value ?? SUGGESTED_TYPES), ...page.items.map((e) => e.type)]),
  });
  private readonly typedType = toSignal(this.filters.controls.type.valueChanges, { initialValue: this.filters.controls.type.value });
  protected readonly typeOptions = computed(() => {
    const typed = this.typedType().trim().toLowerCase();
    return [...this.seenTypes()].filter((type) => type.includes(typed) || trailEventLabel(type).toLowerCase().includes(typed)).sort();
  });

  protected readonly json = fullJson;

  constructor() {
    // Typing waits for a pause; choosing from a list or a calendar applies at once.
    const c = this.filters.controls;
    merge(
      merge(c.recipe.valueChanges, c.type.valueChanges, c.userId.valueChanges).pipe(debounceTime(TRAIL_TYPING_DEBOUNCE_MS)),
      merge(c.from.valueChanges, c.to.valueChanges, c.family.valueChanges, c.hideSignIns.valueChanges),
    )
      .pipe(takeUntilDestroyed())
      .subscribe(() => this.applyFilters());

    // Back / forward or a pasted link: show the URL's filters in the fields.
    effect(() => {
      const p = this.params();
      untracked(() => this.showInFields(p));
    });
  }

  /** The person select applies at once. */
  protected pickUser(): void {
    this.applyFilters();
  }

  protected pickType(): void {
    this.applyFilters();
  }

  protected olderEvents(): void {
    const next = this.page().nextBefore;
    if (next !== null) this.navigate({ ...this.params(), before: next });
    this.scrollToTable();
  }

  protected newestEvents(): void {
    this.navigate({ ...this.params(), before: null });
    this.scrollToTable();
  }

  /** "Older events" sits below the list: bring the new page's first row into view. */
  private scrollToTable(): void {
    this.tableTop()?.nativeElement.scrollIntoView?.({ block: 'start' });
  }

  protected clearFilters(): void {
    this.navigate(TRAIL_DEFAULTS);
  }

  /** Opens the trail at one event, without filters, so its neighbours show around it. */
  protected showEvent(id: number): void {
    this.navigate({ ...TRAIL_DEFAULTS, before: id + 1 });
  }

  protected toggle(id: number): void {
    this.expanded.update((open) => {
      const next = new Set(open);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  }

  protected verifyChain(): void {
    this.verifying.set(true);
    this.verifyFailed.set(false);
    this.verification.set(null);
    this.api.verify().subscribe({
      next: (result) => {
        this.verifying.set(false);
        this.verification.set(result);
      },
      error: () => {
        // The error interceptor has already told the user what went wrong.
        this.verifying.set(false);
        this.verifyFailed.set(true);
      },
    });
  }

  protected personLabel(person: PersonNameDto): string {
    return `${person.displayName}${person.active ? '' : ' · inactive'}`;
  }

  /** One page of events for the URL's filters; a recipe number is looked up first. Never fails: a failure is part of the answer. */
  private loadEvents(p: TrailParams): Observable<TrailLoad> {
    return this.resolveRecipe(p.recipe).pipe(
      switchMap((recipe) => {
        if (recipe.state === 'unknown' || recipe.state === 'failed') return of({ recipe, page: EMPTY_PAGE, failed: false });
        const query = { ...toTrailFilters(p, recipe.state === 'id' ? recipe.id : null), before: p.before ?? undefined, limit: TRAIL_PAGE_SIZE };
        // The error interceptor has already told the user what went wrong.
        return this.api.list(query).pipe(
          map((page) => ({ recipe, page, failed: false })),
          catchError(() => of({ recipe, page: EMPTY_PAGE, failed: true })),
        );
      }),
    );
  }

  private resolveRecipe(reference: string): Observable<RecipeFilter> {
    if (!reference) return of({ state: 'none' });
    const id = recipeIdOf(reference);
    if (id !== null) return of({ state: 'id', id, number: null });
    return this.recipes.list({ q: reference, pageSize: 25 }).pipe(
      map((page): RecipeFilter => {
        const match = page.items.find((r) => r.number.toLowerCase() === reference.toLowerCase());
        return match ? { state: 'id', id: match.id, number: match.number } : { state: 'unknown', reference };
      }),
      catchError(() => of<RecipeFilter>({ state: 'failed' })),
    );
  }

  private applyFilters(): void {
    const f = this.filters.getRawValue();
    const userId = f.userId !== null && Number.isInteger(Number(f.userId)) && Number(f.userId) > 0 ? Number(f.userId) : null;
    const next: TrailParams = {
      recipe: f.recipe.trim(),
      userId,
      type: f.type.trim(),
      family: f.family,
      hideSignIns: f.hideSignIns,
      from: f.from,
      to: f.to,
      before: null,
    };
    const p = this.params();
    const same = (Object.keys(next) as (keyof TrailParams)[]).every((key) => key === 'before' || next[key] === p[key]);
    if (!same) this.navigate(next, true);
  }

  private navigate(next: TrailParams, replaceUrl = false): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: toTrailQueryParams(next), replaceUrl });
  }

  private showInFields(p: TrailParams): void {
    const c = this.filters.controls;
    const quiet = { emitEvent: false };
    if (c.recipe.value.trim() !== p.recipe) c.recipe.setValue(p.recipe, quiet);
    if ((c.userId.value || null) !== p.userId) c.userId.setValue(p.userId, quiet);
    if (c.type.value.trim() !== p.type) c.type.setValue(p.type, quiet);
    if (c.family.value !== p.family) c.family.setValue(p.family, quiet);
    if (c.hideSignIns.value !== p.hideSignIns) c.hideSignIns.setValue(p.hideSignIns, quiet);
    if (c.from.value !== p.from) c.from.setValue(p.from, quiet);
    if (c.to.value !== p.to) c.to.setValue(p.to, quiet);
  }
}
