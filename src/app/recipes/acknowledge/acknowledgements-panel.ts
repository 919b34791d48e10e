import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { AcknowledgementsDto } from '@shared/recipe-types';
import { AcknowledgeApi } from '../../core/api/acknowledge-api';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

type Load = { state: 'loading' } | { state: 'failed' } | { state: 'ready'; list: AcknowledgementsDto };

/**
 * Who has read and understood an approved version, and which operators of its machine have
 * not yet: for authors, approvers, auditors and admins on the recipe page.
 */
@Component({
  selector: 'kb-acknowledgements-panel',
  imports: [LabDatePipe, MatIconModule, MatProgressBarModule],
  template: `
    @switch (load().state) {
      @case ('loading') {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the acknowledgements" />
      }
      @case ('failed') {
        <p class="kb-muted" role="status">The acknowledgements could not be loaded. Try again in a moment.</p>
      }
    }
    @if (list(); as a) {
      @if (!a.acknowledged.length && !a.pending.length) {
        <p class="kb-muted" data-testid="no-operators">No operators are assigned to {{ a.machine.name }}.</p>
      } @else {
        <p class="kb-muted kb-summary">
          @let total = a.acknowledged.length + a.pending.length;
          {{ a.acknowledged.length }} of {{ total }} {{ total === 1 ? 'operator' : 'operators' }} of {{ a.machine.name }}
          {{ total === 1 ? 'has' : 'have' }} acknowledged version {{ a.version }}.
        </p>
        <div class="kb-columns">
          <section aria-labelledby="kb-ack-pending" data-testid="pending">
            <h2 id="kb-ack-pending"><mat-icon aria-hidden="true">hourglass_empty</mat-icon>Not yet ({{ a.pending.length }})</h2>
            @if (a.pending.length) {
              <ul>
                @for (p of a.pending; track p.userId) {
                  <li>{{ p.displayName }}</li>
                }
              </ul>
            } @else {
              <p class="kb-muted">Everyone has acknowledged.</p>
            }
          </section>
          <section aria-labelledby="kb-ack-done" data-testid="acknowledged">
            <h2 id="kb-ack-done"><mat-icon aria-hidden="true">task_alt</mat-icon>Acknowledged ({{ a.acknowledged.length }})</h2>
            @if (a.acknowledged.length) {
              <ul>
                @for (x of a.acknowledged; track x.userId) {
                  <li>
                    {{ x.displayName }}
                    <time class="kb-when" [attr.datetime]="x.acknowledgedAt">{{ x.acknowledgedAt | labDate: 'time' }}</time>
                  </li>
                }
              </ul>
            } @else {
              <p class="kb-muted">Nobody yet.</p>
            }
          </section>
        </div>
      }
    }
  `,
  styles: `
    :host {
      display: block;
      padding: 16px 0 0;
    }
    .kb-muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .kb-summary {
      margin: 0 0 12px;
    }
    .kb-columns {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(280px, 1fr));
      gap: 16px;
    }
    h2 {
      display: flex;
      align-items: center;
      gap: 6px;
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-primary);
      margin: 0 0 8px;
    }
    ul {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      display: flex;
      justify-content: space-between;
      gap: 12px;
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .kb-when {
      color: var(--mat-sys-on-surface-variant);
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgementsPanel {
  private readonly api = inject(AcknowledgeApi);

  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();

  protected readonly load = toSignal(
    toObservable(computed(() => ({ recipeId: this.recipeId(), version: this.version() }))).pipe(
      switchMap(({ recipeId, version }) =>
        this.api.acknowledgements(recipeId, version).pipe(
          map((list): Load => ({ state: 'ready', list })),
          // The error interceptor has said why.
          catchError(() => of<Load>({ state: 'failed' })),
          startWith<Load>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Load },
  );
  protected readonly list = computed(() => {
    const load = this.load();
    return load.state === 'ready' ? load.list : null;
  });
}
