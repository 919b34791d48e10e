import type { Route } from '@angular/router';
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

  it('gives each navigation entry the same access as the route it opens', () => {
    for (const item of NAV_ITEMS) {
      const match = all.find(({ path }) => '/' + path === item.path);
      expect(match, `no route for nav entry ${item.path}`).toBeDefined();
      expect((match!.route.data as AccessData).access).toEqual(item.access);
    }
  });
});
