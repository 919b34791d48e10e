import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { type Observable, catchError, distinctUntilChanged, firstValueFrom, forkJoin, map, of, switchMap } from 'rxjs';
import type { MyAcknowledgementDto, RecipeVersionDto } from '../../../../shared/recipe-types';
import type { MachineRecord, WheelRecord } from '../../../../shared/stock-types';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Session } from '../../core/session/session';
import { benchSheetUrl } from '../../core/api/bench-sheet';
import { KeyParameters } from './key-parameters';
import { RecipeApi } from '../../core/api/recipe-api';
import { RECIPE_STATUS_INFO, RecipeStatusChip } from '../../ui/recipe-status-chip';
import { utcToday } from '../../ui/signature-meaning';
import { StockApi } from '../../core/api/stock-api';
import { MarkdownView } from '../../ui/markdown-view';
import { AcknowledgeApi } from '../../core/api/acknowledge-api';
import { acknowledgeStatement } from '../../ui/acknowledgement-state';

type Load = { state: 'loading' } | { state: 'missing' } | { state: 'failed' } | { state: 'ready'; version: RecipeVersionDto };

interface Stock {
  wheel: WheelRecord | null;
  machine: MachineRecord | null;
}

const NO_STOCK: Stock = { wheel: null, machine: null };

/**
 * Acknowledge (the link in a "new version in use" mail, /recipes/:id/acknowledge?v=N): the
 * operator reads what changed and the key settings of a new version of their machine's
 * recipe, then confirms they have read and understood it. Until then its bench sheet stays shut.
 */
@Component({
  selector: 'kb-acknowledge-page',
  imports: [DatePipe, KeyParameters, MarkdownView, MatButtonModule, MatIconModule, MatProgressBarModule, RecipeStatusChip, RouterLink],
  templateUrl: './acknowledge-page.html',
  styleUrl: './acknowledge-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgePage {
  private readonly recipes = inject(RecipeApi);
  private readonly stockApi = inject(StockApi);
  private readonly api = inject(AcknowledgeApi);
  private readonly session = inject(Session);
  private readonly injector = inject(Injector);

  /** Route parameter `:id` (numeric, see numericIdParam). */
  readonly id = input.required<string>();
  /** Query parameter `?v=N`: the version to acknowledge. */
  readonly v = input<string>();

  protected readonly load = signal<Load>({ state: 'loading' });
  protected readonly stock = signal<Stock>(NO_STOCK);
  /** The operator's acknowledgement, from the version and then from the server's answer. */
  protected readonly mine = signal<MyAcknowledgementDto | null>(null);
  /** Acknowledged on this visit (rather than before). */
  protected readonly justAcknowledged = signal(false);
  protected readonly busy = signal(false);
  /** The server's reason when it refuses the acknowledgement (409). */
  protected readonly refusal = signal('');

  protected readonly version = computed(() => {
    const load = this.load();
    return load.state === 'ready' ? load.version : null;
  });
  protected readonly statement = computed(() => {
    const v = this.version();
    return v ? acknowledgeStatement(v.number, v.version) : '';
  });
  /** What the page offers: the statement to confirm, the confirmation, or why there is nothing to do. */
  protected readonly mode = computed<'acknowledge' | 'acknowledged' | 'not-required'>(() => {
    const mine = this.mine();
    if (mine?.acknowledgedAt) return 'acknowledged';
    if (mine?.required) return 'acknowledge';
    return 'not-required';
  });
  protected readonly sheetUrl = computed(() => {
    const v = this.version();
    return v ? benchSheetUrl(v.recipeId, v.version) : null;
  });
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly statusLabel = (status: RecipeVersionDto['status']) => RECIPE_STATUS_INFO[status].label;
  /** The confirmation box: it takes the focus (and the scroll) once the acknowledgement is recorded. */
  private readonly confirmation = viewChild<ElementRef<HTMLElement>>('confirmation');
  /** YYYY-MM-DD (UTC), to word an effective date still to come. */
  protected readonly today = utcToday();

  constructor() {
    toObservable(computed(() => ({ id: Number(this.id()), v: Number(this.v()) })))
      .pipe(
        distinctUntilChanged((a, b) => a.id === b.id && a.v === b.v),
        switchMap(({ id, v }) => {
          this.load.set({ state: 'loading' });
          this.refusal.set('');
          this.justAcknowledged.set(false);
          return this.fetch(id, v).pipe(
            map((version): Load => (version ? { state: 'ready', version } : { state: 'missing' })),
            catchError((e: unknown) => of<Load>(isApiError(e) && e.status === 404 ? { state: 'missing' } : { state: 'failed' })),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((load) => {
        this.load.set(load);
        this.mine.set(load.state === 'ready' ? (load.version.myAcknowledgement ?? null) : null);
      });

    // Names of the machine and wheel for the key settings; the ids stand in until they arrive.
    toObservable(this.version)
      .pipe(
        map((v) => (v ? { wheelId: v.content.cutting.wheelId, machineId: v.content.cutting.machineId } : null)),
        distinctUntilChanged((a, b) => a?.wheelId === b?.wheelId && a?.machineId === b?.machineId),
        switchMap((ids) =>
          ids
            ? forkJoin({ wheel: this.orNull(this.stockApi.wheels.get(ids.wheelId)), machine: this.orNull(this.stockApi.machines.get(ids.machineId)) })
            : of(NO_STOCK),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((stock) => this.stock.set(stock));
  }

  protected async acknowledge(): Promise<void> {
    const v = this.version();
    if (!v || this.busy()) return;
    this.refusal.set('');
    this.busy.set(true);
    try {
      this.mine.set(await firstValueFrom(this.api.acknowledge(v.recipeId, v.version, callerHandles(409))));
      this.justAcknowledged.set(true);
      // The button sat at the end of the page; the confirmation shows at the top.
      afterNextRender(() => this.confirmation()?.nativeElement.focus(), { injector: this.injector });
    } catch (e) {
      // A refusal is shown here; anything else has been shown by the error interceptor.
      if (isApiError(e) && e.status === 409) this.refusal.set(e.generalMessage);
    } finally {
      this.busy.set(false);
    }
  }

  /**
   * The version the link names. A link without `?v=` (typed by hand) takes the newest
   * approved version; only the single version says whether this operator must acknowledge it.
   */
  private fetch(id: number, v: number): Observable<RecipeVersionDto | null> {
    if (Number.isInteger(v) && v > 0) return this.recipes.version(id, v, callerHandles(404));
    return this.recipes.versions(id, callerHandles(404)).pipe(
      map((list) => list.find((x) => x.status === 'approved')?.version ?? null),
      switchMap((newest) => (newest === null ? of(null) : this.recipes.version(id, newest, callerHandles(404)))),
    );
  }

  private orNull<T>(request: Observable<T>): Observable<T | null> {
    // Shown by the error interceptor; the ids stand in for the names.
    return request.pipe(catchError(() => of(null)));
  }
}
