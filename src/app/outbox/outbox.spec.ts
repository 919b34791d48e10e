import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { OutboxEntryDto } from '@shared/api-types';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { Outbox } from './outbox';
import { provideLabDateFormat } from '../../testing/lab-date-format';

describe('Outbox', () => {
  let fixture: ComponentFixture<Outbox>;
  let backend: HttpTestingController;
  let root: HTMLElement;

  const origin = window.location.origin;
  const invitation: OutboxEntryDto = {
    id: 11,
    to: 'naoko@lab.example',
    subject: 'You are invited to Kerfbook',
    kind: 'invitation',
    created: '2026-12-01T09:00:00.000Z',
    sent: null,
    attempts: 2,
    lastError: 'connect ECONNREFUSED 127.0.0.1:1025',
    sendAfter: '2026-12-01T09:05:00.000Z',
    text: `Hello Naoko,\n\nChoose your password: ${origin}/set-password?token=abc.\nNot us? See https://elsewhere.example/x`,
  };
  const reset: OutboxEntryDto = {
    ...invitation,
    id: 10,
    subject: 'Reset your Kerfbook password',
    kind: 'password-reset',
    sent: '2026-12-01T08:00:05.000Z',
    // Sent at the first try: the outbox counts failed tries only.
    attempts: 0,
    lastError: null,
  };
  const sentAfterFailures: OutboxEntryDto = { ...reset, id: 9, subject: 'A version waits for your review', attempts: 2 };
  const waiting: OutboxEntryDto = { ...invitation, id: 8, subject: 'Not tried yet', attempts: 0, lastError: null };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Outbox],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideLabDateFormat(),
        { provide: Notifier, useValue: { show: vi.fn() } },
        { provide: Session, useValue: { clear: vi.fn() } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Outbox);
    root = fixture.nativeElement;
    (await vi.waitFor(() => backend.expectOne({ method: 'GET', url: '/api/dev/outbox' }))).flush({ items: [invitation, reset, sentAfterFailures, waiting] });
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(mainRows()).toHaveLength(4);
    });
  });

  afterEach(() => backend.verify());

  function mainRows(): HTMLElement[] {
    return Array.from(root.querySelectorAll<HTMLElement>('tr.mat-mdc-row:not(.kb-mail-row)'));
  }

  it('lists the queued mails with their delivery state', () => {
    const [first, second] = mainRows();
    expect(first.textContent).toContain('naoko@lab.example');
    expect(first.textContent).toContain('You are invited to Kerfbook');
    expect(first.textContent).toContain('Not sent');
    expect(first.textContent).toContain('2 attempts');
    expect(first.textContent).toContain('ECONNREFUSED');
    expect(second.textContent).toContain('Sent');
    expect(second.textContent).toContain('1 attempt');
    expect(root.querySelector('[data-testid="mail-text"]')).toBeNull();
  });

  it('counts the successful try of a sent mail: never "0 attempts"', () => {
    const tries = mainRows().map((row) => row.querySelector('[data-testid="tries"]')?.textContent?.trim());
    expect(tries).toEqual(['2 attempts', '1 attempt', '3 attempts', 'not tried yet']);
    expect(root.textContent).not.toContain('0 attempts');
  });

  it("opens a mail's text with links to this site only", async () => {
    const open = root.querySelector<HTMLButtonElement>('button[aria-label="Open mail: You are invited to Kerfbook"]')!;
    open.click();
    await fixture.whenStable();
    expect(open.getAttribute('aria-expanded')).toBe('true');
    const mail = root.querySelector('[data-testid="mail-text"]')!;
    expect(mail.textContent).toContain('Hello Naoko,');
    const links = Array.from(mail.querySelectorAll('a'));
    expect(links).toHaveLength(1);
    expect(links[0].getAttribute('href')).toBe('/set-password?token=abc');
    expect(links[0].textContent).toBe(`${origin}/set-password?token=abc`);
    expect(mail.textContent).toContain('https://elsewhere.example/x');
  });

  it('asks again on Refresh', async () => {
    const refresh = Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes('Refresh'))!;
    refresh.click();
    (await vi.waitFor(() => backend.expectOne('/api/dev/outbox'))).flush({ items: [] });
    await vi.waitFor(async () => {
      await fixture.whenStable();
      expect(root.textContent).toContain('No mail has been queued yet.');
    });
  });
});
