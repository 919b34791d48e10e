/**
 * What the simulated people do, one loop per person until the run ends: authors search,
 * copy recipes into new drafts or start new versions, edit (each save with the revision it
 * started from) and submit; approvers sign what is in review (password, meaning, every
 * warning acknowledged) or send it back; operators find their saw's recipes, acknowledge new
 * versions, print bench sheets and log cuts; auditors read the trail. Every write that got a
 * 2xx is written down in the ledger, to be looked up in the database afterwards.
 */
import type { Page } from '../../shared/api-types';
import type { CutRecordDto, MyAcknowledgementDto, RecipeSummary, RecipeVersionDto } from '../../shared/recipe-types';
import type { SoakLab, SoakPerson } from './people';
import { SoakClient, type Answer, type RequestRecord } from './client';

export interface VersionRef {
  recipeId: number;
  version: number;
}

/** Every write that got a 2xx. */
export interface Ledger {
  created: (VersionRef & { by: number })[];
  saved: (VersionRef & { revision: number })[];
  submitted: (VersionRef & { revision: number })[];
  approved: (VersionRef & { signerId: number })[];
  returned: VersionRef[];
  acknowledged: (VersionRef & { userId: number })[];
  printed: (VersionRef & { userId: number })[];
  cuts: { id: number; specimenId: string; userId: number }[];
}

export function emptyLedger(): Ledger {
  return { created: [], saved: [], submitted: [], approved: [], returned: [], acknowledged: [], printed: [], cuts: [] };
}

export interface WorkloadContext {
  lab: SoakLab;
  baseUrl: () => string;
  clock: () => number;
  endMs: number;
  thinkMs: number;
  ledger: Ledger;
  record: (r: RequestRecord) => void;
  /** Approve requests on their way now (the app-kill fault waits for one). */
  approvesInFlight: { n: number };
}

const SEARCH_WORDS = ['bar', 'steel', 'tube', 'transverse', 'cut', 'hardened', 'brass', 'alloy', 'plate', 'KB-00', 'casting', 'shaft'];
const pick = <T>(list: readonly T[]): T => list[Math.floor(Math.random() * list.length)]!;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const versionPath = (v: VersionRef) => `/api/recipes/${v.recipeId}/versions/${v.version}`;

/** Runs one person until the end of the run. */
export async function runPerson(person: SoakPerson, ctx: WorkloadContext): Promise<void> {
  const client = new SoakClient(ctx.baseUrl, ctx.record, ctx.clock);
  // People arrive over the first half minute (a quarter of a short run), as at a shift start.
  await sleep(Math.random() * Math.min(30_000, ctx.endMs / 4));
  let signedIn = false;
  let signInFailures = 0;
  const state: PersonState = { draft: null, saves: 0, specimen: 0 };
  while (ctx.clock() < ctx.endMs) {
    if (!signedIn) {
      signedIn = await client.signIn(person.username, person.password);
      if (!signedIn) {
        // Back off as a person would (1, 2, 4 … 16 s): retrying at once only queues more password hashes.
        signInFailures += 1;
        await sleep(Math.min(16_000, 1000 * 2 ** (signInFailures - 1)) * (0.5 + Math.random()));
        continue;
      }
      signInFailures = 0;
    }
    let last: Answer<unknown> | null = null;
    const tracked = { track: (a: Answer<unknown>) => (last = a) };
    try {
      await ACTIONS[person.role](client, person, ctx, state, tracked.track);
    } catch (err) {
      console.error(`[soak] ${person.username}: ${err instanceof Error ? err.stack : String(err)}`);
    }
    const answered = last as Answer<unknown> | null;
    // Signed out (e.g. a session lost): sign in again. Nothing there (app or database down): back off.
    if (answered?.status === 401) signedIn = false;
    const backOff = answered && (answered.status === 0 || answered.status === 503) ? 1000 : 0;
    await sleep(backOff + ctx.thinkMs * (0.5 + Math.random()));
  }
}

interface PersonState {
  draft: RecipeVersionDto | null;
  saves: number;
  specimen: number;
}

type Track = (a: Answer<unknown>) => unknown;
type Action = (client: SoakClient, person: SoakPerson, ctx: WorkloadContext, state: PersonState, track: Track) => Promise<void>;

async function get<T>(client: SoakClient, track: Track, kind: string, path: string): Promise<Answer<T>> {
  const a = await client.call<T>(kind, 'GET', path);
  track(a);
  return a;
}

async function send<T>(client: SoakClient, track: Track, kind: string, method: string, path: string, body: unknown): Promise<Answer<T>> {
  const a = await client.call<T>(kind, method, path, body);
  track(a);
  return a;
}

async function search(client: SoakClient, track: Track, extra = ''): Promise<RecipeSummary[]> {
  const res = await get<Page<RecipeSummary>>(client, track, 'search', `/api/recipes?q=${encodeURIComponent(pick(SEARCH_WORDS))}&pageSize=25${extra}`);
  return res.ok ? res.body.items : [];
}

const ACTIONS: Record<SoakPerson['role'], Action> = {
  async author(client, person, ctx, state, track) {
    if (Math.random() < 0.25) {
      await search(client, track);
      return;
    }
    if (state.draft) {
      const open = await get<RecipeVersionDto>(client, track, 'open', versionPath(state.draft));
      if (!open.ok || open.body.status !== 'draft') {
        if (open.status !== 0 && open.status !== 503) state.draft = null;
        return;
      }
      const v = open.body;
      if (state.saves < 1 + Math.floor(Math.random() * 3)) {
        const content = { ...v.content, acceptanceMd: `${v.content.acceptanceMd}\n- Looked over again (edit ${state.saves + 1}).` };
        const saved = await send<RecipeVersionDto>(client, track, 'save', 'PUT', versionPath(v), { revision: v.revision, title: v.title, content });
        if (saved.ok) {
          ctx.ledger.saved.push({ recipeId: v.recipeId, version: v.version, revision: saved.body.revision });
          state.saves += 1;
        }
        return;
      }
      const submitted = await send<RecipeVersionDto>(client, track, 'submit', 'POST', `${versionPath(v)}/submit`, { revision: v.revision });
      if (submitted.ok) ctx.ledger.submitted.push({ recipeId: v.recipeId, version: v.version, revision: submitted.body.revision });
      if (submitted.status !== 0 && submitted.status !== 503) state.draft = null;
      return;
    }
    // Something to start from: an approved recipe of the library.
    const list = await get<Page<RecipeSummary>>(client, track, 'search', `/api/recipes?status=approved&pageSize=50&page=${Math.floor(Math.random() * 2)}`);
    const items = list.ok ? list.body.items : [];
    if (items.length === 0) return;
    const source = pick(items);
    if (Math.random() < 0.3) {
      const made = await send<RecipeVersionDto>(client, track, 'new-version', 'POST', `/api/recipes/${source.id}/versions`, {
        fromVersion: source.version,
        changeReason: 'Clamping note reworded after a bench trial.',
      });
      if (made.ok) {
        ctx.ledger.created.push({ recipeId: made.body.recipeId, version: made.body.version, by: person.id });
        state.draft = made.body;
        state.saves = 0;
      }
      return;
    }
    const open = await get<RecipeVersionDto>(client, track, 'open', versionPath({ recipeId: source.id, version: source.version }));
    if (!open.ok) return;
    const src = open.body;
    const saws = ctx.lab.sawsByModel.get(src.content.cutting.machineId) ?? [src.content.cutting.machineId];
    const content = { ...src.content, changeReason: '', cutting: { ...src.content.cutting, machineId: pick(saws) } };
    const made = await send<RecipeVersionDto>(client, track, 'create', 'POST', '/api/recipes', {
      title: `${src.title.slice(0, 120)} (${person.username})`,
      content,
    });
    if (made.ok) {
      ctx.ledger.created.push({ recipeId: made.body.recipeId, version: made.body.version, by: person.id });
      state.draft = made.body;
      state.saves = 0;
    }
  },

  async approver(client, person, ctx, _state, track) {
    if (Math.random() < 0.15) {
      await get(client, track, 'today', '/api/today');
      return;
    }
    const list = await get<Page<RecipeSummary>>(client, track, 'search', '/api/recipes?status=in-review&sort=updatedAt&dir=asc&pageSize=20');
    const items = list.ok ? list.body.items : [];
    if (items.length === 0) return;
    const item = pick(items);
    const open = await get<RecipeVersionDto>(client, track, 'open', versionPath({ recipeId: item.id, version: item.version }));
    if (!open.ok || open.body.status !== 'in-review') return;
    const v = open.body;
    if (Math.random() < 0.1) {
      const res = await send(client, track, 'return', 'POST', `${versionPath(v)}/return`, {
        revision: v.revision,
        comment: 'Please give the clamping positions in mm.',
      });
      if (res.ok) ctx.ledger.returned.push({ recipeId: v.recipeId, version: v.version });
      return;
    }
    ctx.approvesInFlight.n += 1;
    try {
      // The electronic signature: password again, its meaning, every warning acknowledged (as test/api/workflow/workflow-support.ts).
      const res = await send(client, track, 'approve', 'POST', `${versionPath(v)}/approve`, {
        revision: v.revision,
        username: person.username,
        password: person.password,
        meaning: 'approved',
        acknowledgedWarnings: v.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
      });
      if (res.ok) ctx.ledger.approved.push({ recipeId: v.recipeId, version: v.version, signerId: person.id });
    } finally {
      ctx.approvesInFlight.n -= 1;
    }
  },

  async operator(client, person, ctx, state, track) {
    if (Math.random() < 0.15) {
      await get(client, track, 'finder', `/api/finder?machineId=${person.machineId}&sizeMm=${10 + Math.floor(Math.random() * 60)}`);
      return;
    }
    const list = await get<Page<RecipeSummary>>(client, track, 'search', `/api/recipes?machineId=${person.machineId}&pageSize=50`);
    const items = (list.ok ? list.body.items : []).filter((r) => r.status === 'approved');
    if (items.length === 0) return;
    const item = pick(items);
    const ref = { recipeId: item.id, version: item.version };
    const open = await get<RecipeVersionDto>(client, track, 'open', versionPath(ref));
    if (!open.ok) return;
    if (open.body.myAcknowledgement?.required) {
      const ack = await send<MyAcknowledgementDto>(client, track, 'acknowledge', 'POST', `${versionPath(ref)}/acknowledge`, {});
      if (!ack.ok) return;
      ctx.ledger.acknowledged.push({ ...ref, userId: person.id });
    }
    if (Math.random() < 0.5) {
      const sheet = await get(client, track, 'print', `${versionPath(ref)}/sheet.pdf`);
      if (sheet.ok) ctx.ledger.printed.push({ ...ref, userId: person.id });
    }
    state.specimen += 1;
    const specimenId = `SOAK-${person.id}-${state.specimen}`;
    const cut = await send<CutRecordDto>(client, track, 'cut', 'POST', `${versionPath(ref)}/cuts`, {
      specimenId,
      partRef: `Heat ${1000 + person.id}`,
      quantity: 1,
      outcome: Math.random() < 0.05 ? 'burnt' : 'good',
      notes: '',
    });
    if (cut.ok) ctx.ledger.cuts.push({ id: cut.body.id, specimenId, userId: person.id });
  },

  async auditor(client, _person, ctx, _state, track) {
    const r = Math.random();
    if (r < 0.05) await get(client, track, 'trail-verify', '/api/trail/verify');
    else if (r < 0.5) await get(client, track, 'trail', '/api/trail?limit=50');
    else if (r < 0.7 && ctx.ledger.cuts.length > 0)
      await get(client, track, 'trace', `/api/cuts?specimenId=${encodeURIComponent(pick(ctx.ledger.cuts).specimenId)}`);
    else await search(client, track);
  },
};
