import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { TodayDto } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import type { DateFormat } from '@shared/vocabulary';
import { aRecipeSummary } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { Today } from './today';
import { provideLabDateFormat } from '../../testing/lab-date-format';

describe('Today', () => {
  let fixture: ComponentFixture<Today>;
  let backend: HttpTestingController;
  let root: HTMLElement;

  const lists: TodayDto = {
    myDrafts: [aRecipeSummary({ id: 4, number: 'KB-0004', title: 'Brass fittings, longitudinal', version: 1, status: 'draft' })],
    waitingForMyReview: [aRecipeSummary({ id: 5, number: 'KB-0005', title: 'Cast iron brake discs', version: 3, status: 'in-review' })],
    reviewsDue: [
      { ...aRecipeSummary({ id: 3, version: 2, status: 'approved' }), reviewDueOn: '2027-01-20' },
      { ...aRecipeSummary({ id: 5, number: 'KB-0005', version: 1, status: 'approved' }), reviewDueOn: '2026-10-01', reviewOverdue: true },
    ],
    flaggedCuts: [],
    toAcknowledge: [],
    notices: [],
  };

  /** `dateFormat`: the lab's date format, as the settings request would answer it. */
  async function open(roles: Role[], answer: TodayDto = lists, dateFormat: DateFormat = 'iso'): Promise<void> {
    TestBed.configureTestingModule({
      imports: [Today],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(dateFormat),
        { provide: Session, useValue: { user: signal(aUser({ roles })), roles: signal(roles), clear: vi.fn() } },
        { provide: Notifier, useValue: { show: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Today);
    root = fixture.nativeElement;
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/today' }))).flush(answer);
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function shownLists(): string[] {
    return Array.from(root.querySelectorAll<HTMLElement>('[data-list]')).map((el) => el.dataset['list']!);
  }

  function list(id: string): HTMLElement {
    return root.querySelector<HTMLElement>(`[data-list="${id}"]`)!;
  }

  it('shows an admin the start-up warnings, as an alert above the lists', async () => {
    const warning = 'APP_BASE_URL is not set, but Kerfbook listens on 0.0.0.0:4300, beyond this computer.';
    await open(['admin'], { ...lists, notices: [warning] });
    const notice = root.querySelector<HTMLElement>('[data-testid="admin-notice"]')!;
    expect(notice.getAttribute('role')).toBe('alert');
    expect(notice.textContent).toContain(warning);
  });

  it('shows no notice block when there is nothing to warn about', async () => {
    await open(['admin']);
    expect(root.querySelector('[data-testid="admin-notice"]')).toBeNull();
  });

  it('keeps the greeting and the roles', async () => {
    await open(['author']);
    expect(root.querySelector('h1')!.textContent).toBe('Hello, Ragna Lindqvist');
    expect(root.querySelector('.kb-roles')!.textContent).toContain('Author');
  });

  it('shows an author their drafts and the reviews due, linking to the recipe', async () => {
    await open(['author']);
    expect(shownLists()).toEqual(['myDrafts', 'reviewsDue']);
    const draft = list('myDrafts').querySelector('a')!;
    expect(draft.textContent).toContain('KB-0004');
    expect(draft.textContent).toContain('Brass fittings, longitudinal');
    expect(draft.getAttribute('href')).toBe('/recipes/4?v=1');
    expect(list('reviewsDue').textContent).toContain('review due 2027-01-20');
    // Past its date: marked, once, on that recipe only.
    const [due, overdue] = Array.from(list('reviewsDue').querySelectorAll('li'));
    expect(due!.querySelector('kb-review-overdue-chip')).toBeNull();
    expect(overdue!.querySelector('kb-review-overdue-chip')?.textContent).toContain('Review overdue');
  });

  it("writes the dates in the lab's format: 05.12.2026, no month names", async () => {
    const drafts = [aRecipeSummary({ id: 4, number: 'KB-0004', version: 1, status: 'draft', updatedAt: '2026-12-05T14:05:00.000Z' })];
    await open(['author'], { ...lists, myDrafts: drafts, reviewsDue: [{ ...lists.reviewsDue[0]!, reviewDueOn: '2027-01-20' }] }, 'dmy-dot');
    expect(list('myDrafts').textContent).toContain('changed 05.12.2026');
    expect(list('reviewsDue').textContent).toContain('review due 20.01.2027');
    expect(root.textContent).not.toMatch(
      /\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)[a-z]* 20\d\d\b|\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b/,
    );
    expect(root.textContent).not.toMatch(/\b20\d\d-\d\d-\d\d\b/);
  });

  it('shows an approver what waits for their review, linking to the review screen', async () => {
    await open(['approver']);
    expect(shownLists()).toEqual(['waitingForMyReview', 'reviewsDue']);
    const item = list('waitingForMyReview').querySelector('a')!;
    expect(item.getAttribute('href')).toBe('/recipes/5/review?v=3');
    expect(item.textContent).toContain('Cast iron brake discs');
    expect(list('waitingForMyReview').querySelector('kb-recipe-status-chip')!.textContent).toContain('In review');
  });

  it('says so when a list is empty', async () => {
    await open(['approver'], { ...lists, waitingForMyReview: [] });
    expect(list('waitingForMyReview').textContent).toContain('Nothing is waiting for your review.');
  });

  it('gives an operator the versions to acknowledge, each linking to the acknowledge page, and not the authors’ flagged cuts', async () => {
    await open(['operator'], {
      ...lists,
      toAcknowledge: [
        aRecipeSummary({ id: 6, number: 'KB-0006', title: 'Aluminium extrusions', version: 4 }),
        aRecipeSummary({ id: 9, number: 'KB-0009', version: 2, machineName: 'Floor saw F1' }),
      ],
    });
    // Flagged cuts are for the recipe's authors to look at; the server sends an operator none.
    expect(shownLists()).toEqual(['toAcknowledge']);
    const links = Array.from(list('toAcknowledge').querySelectorAll('a'));
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/recipes/6/acknowledge?v=4', '/recipes/9/acknowledge?v=2']);
    expect(links[0].textContent).toContain('KB-0006');
    expect(links[0].textContent).toContain('Aluminium extrusions');
    expect(links[1].textContent).toContain('new for Floor saw F1');
    expect(list('toAcknowledge').querySelector('.kb-count')!.textContent).toBe('2');
  });

  it('tells an operator when no version waits for their acknowledgement', async () => {
    await open(['operator']);
    expect(list('toAcknowledge').textContent).toContain('No new version is waiting for your acknowledgement.');
    expect(list('toAcknowledge').querySelector('a')).toBeNull();
  });

  it('shows no acknowledgement list to someone who is not an operator and has none', async () => {
    await open(['auditor']);
    expect(shownLists()).not.toContain('toAcknowledge');
  });

  it('shows flagged cuts to others only when there are some', async () => {
    await open(['author'], { ...lists, flaggedCuts: [{ recipeId: 3, number: 'KB-0003', title: 'Tempered bar, transverse', count: 2 }] });
    expect(shownLists()).toEqual(['myDrafts', 'reviewsDue', 'flaggedCuts']);
    expect(list('flaggedCuts').textContent).toContain('2 flagged cuts');
    expect(list('flaggedCuts').querySelector('a')!.getAttribute('href')).toBe('/recipes/3?tab=cuts');
    expect(root.querySelector('[data-testid="operator-start"]')).toBeNull();
  });

  it('gives an operator a large way into the finder and the sheet check', async () => {
    await open(['operator']);
    const start = root.querySelector('[data-testid="operator-start"]')!;
    expect(start.querySelector('a[href="/finder"]')!.textContent).toContain('Find a recipe');
    expect(start.querySelector('a[href="/check"]')!.textContent).toContain('Check a sheet');
  });
});
