import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { Access, Role } from '@shared/roles';
import { accessGuard } from './access-guard';
import { Session } from './session';

@Component({ template: 'page' })
class Page {}

describe('accessGuard', () => {
  const roles = signal<readonly Role[]>([]);
  const signedIn = signal(false);
  const mustChange = signal(false);

  function route(path: string, access: Access) {
    return { path, component: Page, canActivate: [accessGuard], data: { access } };
  }

  beforeEach(() => {
    roles.set([]);
    signedIn.set(false);
    mustChange.set(false);
    TestBed.configureTestingModule({
      providers: [
        { provide: Session, useValue: { roles, isSignedIn: signedIn, mustChangePassword: mustChange } },
        provideRouter([
          route('today', 'signedIn'),
          route('people', ['admin']),
          route('account', 'signedIn'),
          route('sign-in', 'public'),
          route('not-allowed', 'signedIn'),
        ]),
      ],
    });
  });

  async function go(url: string): Promise<string> {
    const router = TestBed.inject(Router);
    await router.navigateByUrl(url);
    return router.url;
  }

  it('sends a signed-out visitor to sign-in with the way back', async () => {
    expect(await go('/people?status=all')).toBe('/sign-in?returnUrl=%2Fpeople%3Fstatus%3Dall');
  });

  it('lets anyone open a public page', async () => {
    expect(await go('/sign-in')).toBe('/sign-in');
  });

  it('lets an admin open an admin page', async () => {
    signedIn.set(true);
    roles.set(['operator', 'admin']);
    expect(await go('/people')).toBe('/people');
  });

  it('refuses an admin page to a user without the role', async () => {
    signedIn.set(true);
    roles.set(['author', 'approver']);
    expect(await go('/people')).toBe('/not-allowed?from=%2Fpeople');
  });

  it('lets any signed-in user open a signedIn page', async () => {
    signedIn.set(true);
    expect(await go('/today')).toBe('/today');
  });

  it('keeps a user with a temporary password on the account page', async () => {
    signedIn.set(true);
    roles.set(['admin']);
    mustChange.set(true);
    expect(await go('/people')).toBe('/account');
    expect(await go('/account')).toBe('/account');
  });
});
