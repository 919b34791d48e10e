import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, firstValueFrom, map, of, startWith, switchMap } from 'rxjs';
import type { CutRecordDto } from '@shared/recipe-types';
import { Notifier } from '../../core/notifier/notifier';
import { CutOutcomeLabel } from '../../ui/cut-outcome-label';
import { CutsApi, cutsCsvUrl } from '../../core/api/cuts-api';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

type Load = { state: 'loading' } | { state: 'failed' } | { state: 'ready'; cuts: CutRecordDto[] };

/** The Cuts tab of a recipe version: every cut made with it, newest first, with a CSV export. */
@Component({
  selector: 'kb-recipe-cuts',
  imports: [CutOutcomeLabel, LabDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './recipe-cuts.html',
  styleUrl: './recipe-cuts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeCuts {
  private readonly api = inject(CutsApi);
  private readonly notifier = inject(Notifier);

  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();
  /** Bumped by the page after a cut is logged, to fetch the list again. */
  readonly reload = input(0);
  /** Authors may mark flagged cuts as seen. */
  readonly canClearFlags = input(false);

  protected readonly csvUrl = computed(() => cutsCsvUrl(this.recipeId(), this.version()));
  protected readonly load = signal<Load>({ state: 'loading' });
  protected readonly clearing = signal<number | null>(null);
  protected readonly flaggedCount = computed(() => {
    const load = this.load();
    return load.state === 'ready' ? load.cuts.filter((c) => isFlagged(c)).length : 0;
  });
  protected readonly isFlagged = isFlagged;

  constructor() {
    toObservable(computed(() => ({ recipeId: this.recipeId(), version: this.version(), reload: this.reload() })))
      .pipe(
        switchMap(({ recipeId, version }) =>
          this.api.forVersion(recipeId, version).pipe(
            map((cuts): Load => ({ state: 'ready', cuts })),
            // The error interceptor has said why.
            catchError(() => of<Load>({ state: 'failed' })),
            startWith<Load>({ state: 'loading' }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((load) => this.load.set(load));
  }

  protected async markSeen(cut: CutRecordDto): Promise<void> {
    this.clearing.set(cut.id);
    try {
      const updated = await firstValueFrom(this.api.clearFlag(cut.id));
      this.load.update((load) => (load.state === 'ready' ? { state: 'ready', cuts: load.cuts.map((c) => (c.id === updated.id ? updated : c)) } : load));
      void this.notifier.show(`Cut of specimen ${updated.specimenId} marked as seen.`);
    } catch {
      // The error interceptor has said why; the flag stays.
    } finally {
      this.clearing.set(null);
    }
  }
}

function isFlagged(cut: CutRecordDto): boolean {
  return cut.outcome !== 'good' && cut.flagClearedAt === null;
}
