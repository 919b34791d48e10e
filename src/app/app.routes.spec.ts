import { computed, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { type Route, type Routes, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { UserDto } from '@shared/api-types';
import { aUser } from '../testing/user-fixture';
import { Session } from './core/session/session';
import { routes } from './app.routes';
import type { AccessData } from './core/session/access-guard';
import { accessGuard } from './core/session/access-guard';
import { NAV_ITEMS } from './core/shell/nav-items';

/** Every route with its full path, walking the children. */
function flatten(table: readonly Route[], prefix = ''): { path: string; route: Route }[] {
  return table.flatMap((route) => {
    const path = [prefix, route.path].filter(Boolean).join('/');
    return [{ path, route }, ...flatten(route.children ?? [], path)];
  });
}

interface WalkedRoute {
  path: string;
  route: Route;
  /** The access of the nearest guarded ancestor, which Angular's data inheritance and the guard apply. */
  inherited: AccessData['access'] | undefined;
}

/** Like flatten, but also into the tables lazily loaded features bring. */
async function flattenWithFeatures(table: readonly Route[], prefix = '', inherited?: AccessData['access']): Promise<WalkedRoute[]> {
  const walked: WalkedRoute[] = [];
  for (const route of table) {
    const path = [prefix, route.path].filter(Boolean).join('/');
    walked.push({ path, route, inherited });
    const own = (route.data as Partial<AccessData> | undefined)?.access;
    const guarded = own !== undefined && (own === 'public' || !!route.canActivate?.includes(accessGuard)) ? own : inherited;
    // The tables lazily loaded features bring (recipes, operator, stock, people).
    const children = route.loadChildren ? await (route.loadChildren as () => Promise<Routes>)() : (route.children ?? []);
    walked.push(...(await flattenWithFeatures(children, path, guarded)));
  }
  return walked;
}

describe('route table', () => {
  const all = flatten(routes);

  it('declares access on every route that shows a page', () => {
    const pages = all.filter(({ route }) => route.loadComponent || route.loadChildren || route.component);
    for (const { path, route } of pages) {
      expect((route.data as Partial<AccessData> | undefined)?.access, `route "${path}"`).toBeDefined();
      if ((route.data as AccessData).access !== 'public') {
        expect(route.canActivate, `route "${path}" is not guarded`).toContain(accessGuard);
      }
    }
  });

  it('ends with a public catch-all page', () => {
    const last = routes[routes.length - 1];
    expect(last.path).toBe('**');
    expect((last.data as AccessData).access).toBe('public');
  });

  it('gives each navigation entry the same access as the route it opens', async () => {
    const withFeatures = await flattenWithFeatures(routes);
    for (const item of NAV_ITEMS) {
      const match = withFeatures.find(({ path }) => '/' + path === item.path);
      expect(match, `no route for nav entry ${item.path}`).toBeDefined();
      expect((match!.route.data as AccessData).access).toEqual(item.access);
    }
  });

  it('declares or inherits access on every page of the lazily loaded features', async () => {
    const pages = (await flattenWithFeatures(routes)).filter(({ route }) => route.loadComponent || route.component);
    for (const { path, route, inherited } of pages) {
      const own = (route.data as Partial<AccessData> | undefined)?.access;
      expect(own ?? inherited, `route "${path}"`).toBeDefined();
      if (own !== undefined && own !== 'public') {
        expect(route.canActivate, `route "${path}" is not guarded`).toContain(accessGuard);
      }
    }
  });

  describe('an address with no page', () => {
    async function visit(user: UserDto | null): Promise<HTMLElement> {
      const current = signal(user);
      TestBed.configureTestingModule({
        providers: [
          provideRouter(routes),
          {
            provide: Session,
            useValue: {
              user: current,
              isSignedIn: computed(() => current() !== null),
              roles: computed(() => current()?.roles ?? []),
              mustChangePassword: signal(false),
              devOutbox: signal(false),
              signOut: vi.fn(),
            },
          },
        ],
      });
      const harness = await RouterTestingHarness.create();
      await harness.navigateByUrl('/no-such-page');
      harness.detectChanges();
      return harness.fixture.nativeElement as HTMLElement;
    }

    it('is shown inside the signed-in shell, with the navigation, to someone signed in', async () => {
      const page = await visit(aUser({ roles: ['author'] }));
      expect(page.querySelector('kb-shell kb-not-found')).not.toBeNull();
      expect(page.querySelector('kb-shell nav a[href="/today"]')).not.toBeNull();
    });

    it('is the public page for someone signed out', async () => {
      const page = await visit(null);
      expect(page.querySelector('kb-not-found')).not.toBeNull();
      expect(page.querySelector('kb-shell')).toBeNull();
    });
  });
});
