import { computed, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { UserDto } from '@shared/api-types';
import type { Role } from '@shared/roles';
import { aUser } from '../../../testing/user-fixture';
import { Session } from '../session/session';
import { Shell } from './shell';

describe('Shell', () => {
  const user = signal<UserDto | null>(null);
  const devOutbox = signal(false);

  async function render(roles: Role[], outbox = false) {
    user.set(aUser({ displayName: 'Tomasz Weber', roles }));
    devOutbox.set(outbox);
    TestBed.configureTestingModule({
      imports: [Shell],
      providers: [
        provideRouter([]),
        {
          provide: Session,
          useValue: { user, roles: computed(() => user()?.roles ?? []), devOutbox, signOut: vi.fn().mockResolvedValue(undefined) },
        },
      ],
    });
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function navLabels(root: HTMLElement): string[] {
    return Array.from(root.querySelectorAll('nav a')).map((a) => a.textContent?.replace(/\s+/g, ' ').trim() ?? '');
  }

  it('shows People to an admin', async () => {
    const root = await render(['admin']);
    expect(navLabels(root).some((label) => label.endsWith('People'))).toBe(true);
    expect(root.querySelector('nav a[href="/people"]')).not.toBeNull();
  });

  it('hides People from everyone else', async () => {
    const root = await render(['author', 'approver', 'operator', 'auditor']);
    expect(root.querySelector('nav a[href="/people"]')).toBeNull();
    expect(root.querySelector('nav a[href="/today"]')).not.toBeNull();
    expect(root.querySelector('nav a[href="/account"]')).not.toBeNull();
  });

  it('shows Outbox to an admin only when the server keeps a development outbox', async () => {
    const root = await render(['admin'], true);
    expect(root.querySelector('nav a[href="/outbox"]')?.textContent).toContain('Outbox');
  });

  it('hides Outbox when the server keeps no development outbox', async () => {
    const root = await render(['admin'], false);
    expect(root.querySelector('nav a[href="/people"]')).not.toBeNull();
    expect(root.querySelector('nav a[href="/outbox"]')).toBeNull();
  });

  it('hides Outbox from non-admins even in development', async () => {
    const root = await render(['author', 'operator'], true);
    expect(root.querySelector('nav a[href="/outbox"]')).toBeNull();
  });

  it('shows the app name and the user display name in the toolbar', async () => {
    const root = await render(['operator']);
    const toolbar = root.querySelector('mat-toolbar')!;
    expect(toolbar.textContent).toContain('Kerfbook');
    expect(toolbar.textContent).toContain('Tomasz Weber');
  });
});
