import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { RecipeSummary, TodayDto } from '@shared/recipe-types';
import { ROLE_INFO, type Role, hasAccess } from '@shared/roles';
import { formatDate } from '@shared/date-format';
import { LabDateFormat } from '../core/dates/lab-date-format';
import { Session } from '../core/session/session';
import { ReviewOverdueChip } from '../ui/review-overdue-chip';
import { RecipeStatusChip } from '../ui/recipe-status-chip';
import { WorkflowApi } from '../core/api/workflow-api';

/** One line of a Today list: where it leads and what it says. */
interface TodayItem {
  key: string;
  link: unknown[];
  query: Record<string, string | number>;
  number: string;
  title: string;
  version: number | null;
  status: RecipeSummary['status'] | null;
  /** A short fact beside the title (due date, count of flagged cuts, machine). */
  detail: string;
  /** The periodic review date has passed: marked "Review overdue". */
  overdue?: boolean;
}

interface TodayList {
  id: keyof TodayDto;
  title: string;
  icon: string;
  empty: string;
  items: TodayItem[];
}

type Load = { state: 'loading' } | { state: 'failed' } | { state: 'ready'; today: TodayDto };

const recipeItem = (r: RecipeSummary, detail: string): TodayItem => ({
  key: `${r.id}-${r.version}`,
  link: ['/recipes', r.id],
  query: { v: r.version },
  number: r.number,
  title: r.title,
  version: r.version,
  status: r.status,
  detail,
});

/** Home page: who you are here, and the work waiting for each of your roles. */
@Component({
  selector: 'kb-today',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RecipeStatusChip, ReviewOverdueChip, RouterLink],
  templateUrl: './today.html',
  styleUrl: './today.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Today {
  private readonly session = inject(Session);
  private readonly dates = inject(LabDateFormat);
  private readonly api = inject(WorkflowApi);

  protected readonly displayName = computed(() => this.session.user()?.displayName ?? '');
  /** Operators start from the finder: a large card leads there. */
  protected readonly isOperator = computed(() => hasAccess(this.session.roles(), ['operator']));
  protected readonly roles = computed(() => this.session.roles().map((role) => ({ role, ...ROLE_INFO[role] })));

  private readonly today = rxResource({ stream: () => this.api.today() });
  protected readonly load = computed<Load>(() => {
    // The error interceptor has said why; the page keeps the greeting and roles.
    if (this.today.error()) return { state: 'failed' };
    return this.today.hasValue() ? { state: 'ready', today: this.today.value() } : { state: 'loading' };
  });

  /** Start-up warnings the server has for admins (e.g. APP_BASE_URL unset). */
  protected readonly notices = computed(() => {
    const load = this.load();
    return load.state === 'ready' ? (load.today.notices ?? []) : [];
  });

  protected readonly lists = computed<TodayList[]>(() => {
    const load = this.load();
    if (load.state !== 'ready') return [];
    const t = load.today;
    const format = this.dates.format();
    const has = (...roles: Role[]) => hasAccess(this.session.roles(), roles);
    const lists: TodayList[] = [];
    if (has('author')) {
      lists.push({
        id: 'myDrafts',
        title: 'My drafts',
        icon: 'edit_note',
        empty: 'You have no open drafts.',
        items: t.myDrafts.map((r) => recipeItem(r, `changed ${formatDate(r.updatedAt, format)}`)),
      });
    }
    if (has('approver')) {
      lists.push({
        id: 'waitingForMyReview',
        title: 'Waiting for my review',
        icon: 'rate_review',
        empty: 'Nothing is waiting for your review.',
        items: t.waitingForMyReview.map((r) => ({ ...recipeItem(r, r.machineName), link: ['/recipes', r.id, 'review'] })),
      });
    }
    if (has('author', 'approver')) {
      lists.push({
        id: 'reviewsDue',
        title: 'Reviews due',
        icon: 'event_repeat',
        empty: 'No periodic review falls due in the next 60 days.',
        items: t.reviewsDue.map((r) => ({ ...recipeItem(r, `review due ${formatDate(r.reviewDueOn, format)}`), overdue: r.reviewOverdue })),
      });
    }
    const operator = has('operator');
    // For the authors who look at them (the server sends them no one else): an operator who is not an author never gets an always-empty panel.
    if (t.flaggedCuts.length) {
      lists.push({
        id: 'flaggedCuts',
        title: 'Cuts flagged by operators',
        icon: 'flag',
        empty: 'No cut has been flagged.',
        items: t.flaggedCuts.map((f) => ({
          key: `flag-${f.recipeId}`,
          // Today only has a count per recipe; the Cuts tab lists the cuts and marks each one as seen.
          link: ['/recipes', f.recipeId],
          query: { tab: 'cuts' },
          number: f.number,
          title: f.title,
          version: null,
          status: null,
          detail: `${f.count === 1 ? '1 flagged cut' : `${f.count} flagged cuts`} · mark as seen in the Cuts tab`,
        })),
      });
    }
    if (t.toAcknowledge.length || operator) {
      lists.push({
        id: 'toAcknowledge',
        title: 'Versions to acknowledge',
        icon: 'task_alt',
        empty: 'No new version is waiting for your acknowledgement.',
        // The same page the mail links to: what changed, the key settings, and the statement to confirm.
        items: t.toAcknowledge.map((r) => ({ ...recipeItem(r, `new for ${r.machineName}`), link: ['/recipes', r.id, 'acknowledge'] })),
      });
    }
    return lists;
  });
}
