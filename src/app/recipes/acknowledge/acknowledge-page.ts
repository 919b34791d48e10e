import {
  ChangeDetectionStrategy,
  Component,
  type ElementRef,
  Injector,
  afterNextRender,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { type Observable, firstValueFrom, map, of, switchMap } from 'rxjs';
import type { MyAcknowledgementDto, RecipeVersionDto } from '@shared/recipe-types';
import { RECIPE_STATUS_LABELS } from '@shared/vocabulary';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { Session } from '../../core/session/session';
import { benchSheetUrl } from '../../core/api/bench-sheet';
import { KeyParameters } from './key-parameters';
import { ChangesSinceAcknowledged } from './changes-since-acknowledged';
import { RecipeApi } from '../../core/api/recipe-api';
import { RecipeStatusChip } from '../../ui/recipe-status-chip';
import { utcToday } from '../../core/dates/calendar';
import { stockNamesOf } from '../../core/api/stock-names';
import { MarkdownView } from '../../ui/markdown-view';
import { AcknowledgeApi } from '../../core/api/acknowledge-api';
import { acknowledgeStatement } from '../../ui/acknowledgement-state';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

type Load = { state: 'loading' } | { state: 'missing' } | { state: 'failed' } | { state: 'ready'; version: RecipeVersionDto };

/**
 * Acknowledge (the link in a "new version in use" mail, /recipes/:id/acknowledge?v=N): the
 * operator reads what changed and the key settings of a new version of their machine's
 * recipe, then confirms they have read and understood it. Until then its bench sheet stays shut.
 */
@Component({
  selector: 'kb-acknowledge-page',
  imports: [
    ChangesSinceAcknowledged,
    LabDatePipe,
    KeyParameters,
    MarkdownView,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RecipeStatusChip,
    RouterLink,
  ],
  templateUrl: './acknowledge-page.html',
  styleUrl: './acknowledge-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgePage {
  private readonly recipes = inject(RecipeApi);
  private readonly api = inject(AcknowledgeApi);
  private readonly session = inject(Session);
  private readonly injector = inject(Injector);

  /** Route parameter `:id` (numeric, see numericIdParam). */
  readonly id = input.required<string>();
  /** Query parameter `?v=N`: the version to acknowledge. */
  readonly v = input<string>();

  private readonly asked = computed(() => ({ id: Number(this.id()), v: Number(this.v()) }), { equal: (a, b) => a.id === b.id && a.v === b.v });
  private readonly versionLoad = rxResource({ params: this.asked, stream: ({ params }) => this.fetch(params.id, params.v) });
  protected readonly load = computed<Load>(() => {
    const load = this.versionLoad;
    if (load.isLoading()) return { state: 'loading' };
    const error = load.error();
    if (error) return isApiError(error) && error.status === 404 ? { state: 'missing' } : { state: 'failed' };
    const version = load.hasValue() ? load.value() : null;
    return version ? { state: 'ready', version } : { state: 'missing' };
  });
  protected readonly version = computed(() => {
    const load = this.load();
    return load.state === 'ready' ? load.version : null;
  });
  /** Names of the machine and wheel for the key settings; the ids stand in until they arrive. */
  protected readonly stock = stockNamesOf(() => this.version()?.content, { withMaterial: false });
  /** The operator's acknowledgement, from the version and then from the server's answer. */
  protected readonly mine = linkedSignal<MyAcknowledgementDto | null>(() => this.version()?.myAcknowledgement ?? null);
  /** Acknowledged on this visit (rather than before); false again for another version. */
  protected readonly justAcknowledged = linkedSignal({ source: this.asked, computation: () => false });
  protected readonly busy = signal(false);
  /** The server's reason when it refuses the acknowledgement (409); cleared for another version. */
  protected readonly refusal = linkedSignal({ source: this.asked, computation: () => '' });
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
  protected readonly statusLabel = (status: RecipeVersionDto['status']) => RECIPE_STATUS_LABELS[status];
  /** The confirmation box: it takes the focus (and the scroll) once the acknowledgement is recorded. */
  private readonly confirmation = viewChild<ElementRef<HTMLElement>>('confirmation');
  /** YYYY-MM-DD (UTC), to word an effective date still to come. */
  protected readonly today = utcToday();

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
}
