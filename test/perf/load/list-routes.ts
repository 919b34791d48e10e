/**
 * Every list route of the app (and the pages the figures load), each called once as a
 * person allowed to, with filters that match real rows: the bench records the SQL each call
 * runs and EXPLAINs it. A new list route belongs here.
 */
import type { BenchRole } from './users';
import type { Samples } from './samples';

export interface RouteCall {
  role: BenchRole;
  path: string;
}

export function listRouteCalls(s: Samples, big: { recipeId: number }): RouteCall[] {
  const f = s.filters[0]!;
  const cur = s.currentVersions[0];
  const q = (params: Record<string, string | number>) => new URLSearchParams(Object.entries(params).map(([k, v]) => [k, String(v)])).toString();
  const mid = Math.max(1, Math.floor((s.trail.minId + s.trail.maxId) / 2));
  const calls: RouteCall[] = [
    // Library: default, search with filters, other sorts and filters, the operators' view.
    { role: 'author', path: '/api/recipes' },
    { role: 'author', path: `/api/recipes?${q({ q: f.q, group: f.group, machineId: f.machineId })}` },
    { role: 'author', path: `/api/recipes?${q({ q: f.q })}` },
    { role: 'author', path: `/api/recipes?${q({ group: f.group, sort: 'title' })}` },
    { role: 'author', path: `/api/recipes?${q({ status: 'approved', sort: 'updatedAt', dir: 'desc' })}` },
    { role: 'author', path: `/api/recipes?${q({ machineId: f.machineId, size: 30, hardnessHv: 200, page: 3 })}` },
    { role: 'operator', path: `/api/recipes?${q({ q: f.q, group: f.group, machineId: f.machineId })}` },
    // A recipe: its versions, one version, the comparison, its review comments.
    { role: 'author', path: `/api/recipes/${s.anyRecipeId}/versions` },
    { role: 'author', path: `/api/recipes/${big.recipeId}/versions/2` },
    { role: 'author', path: `/api/recipes/${big.recipeId}/compare?from=1&to=2` },
    { role: 'approver', path: `/api/recipes/${big.recipeId}/versions/2/comments` },
    // Trail: top, middle, bottom, and each filter.
    { role: 'auditor', path: '/api/trail' },
    { role: 'auditor', path: `/api/trail?before=${mid}` },
    { role: 'auditor', path: `/api/trail?before=${s.trail.minId + 60}` },
    { role: 'auditor', path: `/api/trail?recipeId=${s.anyRecipeId}` },
    { role: 'auditor', path: `/api/trail?type=${encodeURIComponent(s.eventType)}&before=${mid}` },
    { role: 'auditor', path: '/api/trail?from=2026-01-01&to=2026-01-31' },
    // Operator station, people, reviews, Today for every role.
    { role: 'operator', path: `/api/finder?${q({ group: f.group, sizeMm: 30, machineId: f.machineId })}` },
    { role: 'operator', path: `/api/finder?${q({ group: f.group })}` },
    { role: 'admin', path: '/api/users' },
    { role: 'admin', path: `/api/users?${q({ q: 'bench', role: 'author', status: 'active', sort: 'displayName' })}` },
    { role: 'approver', path: '/api/reviews/due' },
    { role: 'operator', path: '/api/today' },
    { role: 'author', path: '/api/today' },
    { role: 'approver', path: '/api/today' },
    { role: 'auditor', path: '/api/today' },
    // Stock lists (small tables, listed so a join onto a large one would show).
    { role: 'author', path: '/api/materials' },
    { role: 'author', path: '/api/wheels' },
    { role: 'author', path: '/api/machines' },
    { role: 'author', path: '/api/selection-rows' },
  ];
  if (s.actorUserId) calls.push({ role: 'auditor', path: `/api/trail?userId=${s.actorUserId}` });
  if (s.specimenId) calls.push({ role: 'operator', path: `/api/cuts?${q({ specimenId: s.specimenId })}` });
  if (s.versionWithCuts) {
    const { recipeId, version } = s.versionWithCuts;
    calls.push({ role: 'author', path: `/api/recipes/${recipeId}/versions/${version}/cuts` });
  }
  if (cur) calls.push({ role: 'author', path: `/api/recipes/${cur.recipeId}/versions/${cur.version}/acknowledgements` });
  if (cur) calls.push({ role: 'operator', path: `/api/recipes/${cur.recipeId}/versions/${cur.version}` });
  return calls;
}
