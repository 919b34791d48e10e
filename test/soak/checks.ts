/**
 * What must hold after the soak: the answers (no 5xx, no hang, except the expected ones
 * while a fault was on), every write that got a 2xx found in MariaDB, no half-done
 * transition (each approved version has its signature and its trail events), the trail's
 * hash chain, and the faults' own promises (503 while the database is down, recovery
 * without a restart, every mail sent once).
 */
import type { Knex } from 'knex';
import { CLAIM_MS } from '../../server/services/mail/worker';
import { verifyChain } from '../../server/services/trail/verify';
import type { CaughtMail } from '../../server/tools/mail-catcher';
import type { FaultLog } from './faults';
import type { RequestRecord } from './client';
import type { Ledger, VersionRef } from './workload';

export interface Check {
  name: string;
  ok: boolean;
  detail: string;
}

export class CheckList {
  readonly checks: Check[] = [];
  add(name: string, ok: boolean, detail = ''): void {
    this.checks.push({ name, ok, detail });
    console.log(`  ${ok ? 'ok  ' : 'FAIL'} ${name}${detail ? ` — ${detail}` : ''}`);
  }
  get passed(): number {
    return this.checks.filter((c) => c.ok).length;
  }
  get failed(): number {
    return this.checks.filter((c) => !c.ok).length;
  }
}

const overlaps = (r: RequestRecord, from: number, to: number) => r.startMs <= to && r.endMs >= from;
const sample = (list: unknown[]) => (list.length === 0 ? '' : ` e.g. ${JSON.stringify(list.slice(0, 3))}`);

/** A failure the faults explain: 503 DATABASE_UNAVAILABLE while MariaDB was away, no answer while the app was dead. */
export function expectedFailure(r: RequestRecord, faults: FaultLog): boolean {
  const db = faults.database;
  if (db && r.status === 503 && r.code === 'DATABASE_UNAVAILABLE' && overlaps(r, db.downMs, (db.recoveredMs ?? Infinity) + 2000)) return true;
  const app = faults.app;
  if (app && r.status === 0 && r.code === 'NETWORK' && overlaps(r, app.killMs, app.upMs + 1000)) return true;
  return false;
}

export function checkAnswers(list: CheckList, records: RequestRecord[], faults: FaultLog): void {
  const users = records.filter((r) => r.kind !== 'fault-probe');
  const unexpected5xx = users.filter((r) => r.status >= 500 && !expectedFailure(r, faults));
  list.add('no 5xx outside the faults', unexpected5xx.length === 0, `${users.length} requests, ${unexpected5xx.length} unexpected 5xx${sample(unexpected5xx)}`);
  const internal = records.filter((r) => r.status === 500);
  list.add('no 500 at all (faults included)', internal.length === 0, `${internal.length}${sample(internal)}`);
  const unanswered = users.filter((r) => r.status === 0 && !expectedFailure(r, faults));
  list.add('every request answered (none hung or dropped outside the app crash)', unanswered.length === 0, `${unanswered.length}${sample(unanswered)}`);
  const writes = users.filter((r) => r.method !== 'GET' && r.status >= 200 && r.status < 300);
  list.add('writes succeeded under load', writes.length > 0, `${writes.length} writes with 2xx`);
}

async function versionRows(db: Knex, refs: VersionRef[]): Promise<Map<string, { id: number; status: string; revision: number }>> {
  const map = new Map<string, { id: number; status: string; revision: number }>();
  const ids = [...new Set(refs.map((r) => r.recipeId))];
  for (let i = 0; i < ids.length; i += 500) {
    const rows = await db('recipe_versions')
      .whereIn('recipe_id', ids.slice(i, i + 500))
      .select('id', 'recipe_id', 'version', 'status', 'revision');
    for (const r of rows) map.set(`${r.recipe_id}/${r.version}`, { id: r.id, status: r.status, revision: r.revision });
  }
  return map;
}

const key = (v: VersionRef) => `${v.recipeId}/${v.version}`;

export async function checkLedger(list: CheckList, db: Knex, ledger: Ledger): Promise<void> {
  const versions = await versionRows(db, [
    ...ledger.created,
    ...ledger.saved,
    ...ledger.submitted,
    ...ledger.approved,
    ...ledger.returned,
    ...ledger.acknowledged,
    ...ledger.printed,
  ]);

  const missing = ledger.created.filter((c) => !versions.has(key(c)));
  list.add('every created draft is in the database', missing.length === 0, `${ledger.created.length} created, ${missing.length} missing${sample(missing)}`);

  const staleSaves = ledger.saved.filter((s) => (versions.get(key(s))?.revision ?? -1) < s.revision);
  list.add(
    'every saved revision is kept (database revision ≥ the one answered)',
    staleSaves.length === 0,
    `${ledger.saved.length} saves, ${staleSaves.length} lost${sample(staleSaves)}`,
  );

  const notSubmitted = ledger.submitted.filter((s) => {
    const v = versions.get(key(s));
    return !v || v.status === 'draft' || v.revision < s.revision;
  });
  list.add(
    'every submitted version left the draft state',
    notSubmitted.length === 0,
    `${ledger.submitted.length} submits, ${notSubmitted.length} lost${sample(notSubmitted)}`,
  );

  const signatures = new Set(
    (await db('signatures').where({ meaning: 'approved' }).select('version_id', 'signer_id')).map(
      (s: { version_id: number; signer_id: number }) => `${s.version_id}:${s.signer_id}`,
    ),
  );
  const lostApprovals = ledger.approved.filter((a) => {
    const v = versions.get(key(a));
    return !v || !['approved', 'superseded', 'withdrawn'].includes(v.status) || !signatures.has(`${v.id}:${a.signerId}`);
  });
  list.add(
    'every approval is in force or later, signed by its approver',
    lostApprovals.length === 0,
    `${ledger.approved.length} approvals, ${lostApprovals.length} lost${sample(lostApprovals)}`,
  );

  // trail_events.entity_id is text (it names entities of any kind).
  const returnedIds = new Set(((await db('trail_events').where({ event_type: 'recipe.version_returned' }).pluck('entity_id')) as string[]).map(Number));
  const lostReturns = ledger.returned.filter((r) => !returnedIds.has(versions.get(key(r))?.id ?? -1));
  list.add(
    'every return to the author is on the trail',
    lostReturns.length === 0,
    `${ledger.returned.length} returns, ${lostReturns.length} lost${sample(lostReturns)}`,
  );

  const acks = new Set(
    (await db('acknowledgements').select('version_id', 'user_id')).map((a: { version_id: number; user_id: number }) => `${a.version_id}:${a.user_id}`),
  );
  const lostAcks = ledger.acknowledged.filter((a) => !acks.has(`${versions.get(key(a))?.id}:${a.userId}`));
  list.add(
    'every acknowledgement is recorded',
    lostAcks.length === 0,
    `${ledger.acknowledged.length} acknowledgements, ${lostAcks.length} lost${sample(lostAcks)}`,
  );

  const prints = new Map<string, number>();
  for (const p of await db('sheet_prints').select('version_id', 'user_id'))
    prints.set(`${p.version_id}:${p.user_id}`, (prints.get(`${p.version_id}:${p.user_id}`) ?? 0) + 1);
  const answered = new Map<string, number>();
  for (const p of ledger.printed) {
    const k = `${versions.get(key(p))?.id}:${p.userId}`;
    answered.set(k, (answered.get(k) ?? 0) + 1);
  }
  const lostPrints = [...answered].filter(([k, n]) => (prints.get(k) ?? 0) < n);
  list.add(
    'every bench sheet handed out is recorded',
    lostPrints.length === 0,
    `${ledger.printed.length} sheets, ${lostPrints.length} (version, operator) pairs short${sample(lostPrints)}`,
  );

  const cutRows = new Map<number, { specimen_id: string; operator_id: number }>();
  const cutIds = ledger.cuts.map((c) => c.id);
  for (let i = 0; i < cutIds.length; i += 1000) {
    for (const r of await db('cut_records')
      .whereIn('id', cutIds.slice(i, i + 1000))
      .select('id', 'specimen_id', 'operator_id'))
      cutRows.set(r.id, r);
  }
  const lostCuts = ledger.cuts.filter((c) => cutRows.get(c.id)?.specimen_id !== c.specimenId || cutRows.get(c.id)?.operator_id !== c.userId);
  list.add('every logged cut is in the database as answered', lostCuts.length === 0, `${ledger.cuts.length} cuts, ${lostCuts.length} lost${sample(lostCuts)}`);
}

/** No half-done transition anywhere in the database, whatever the soak's own ledger says. */
export async function checkConsistency(list: CheckList, db: Knex): Promise<void> {
  // trail_events.entity_id is text (it names entities of any kind).
  const events = async (type: string) =>
    ((await db('trail_events').where({ event_type: type }).select('entity_id', 'after_json')) as { entity_id: string; after_json: unknown }[]).map((e) => ({
      entity_id: Number(e.entity_id),
      after_json: e.after_json,
    }));
  const approvedEvents = await events('recipe.version_approved');
  // mysql2 hands JSON columns over parsed; a TEXT column would come as a string.
  const after = (json: unknown) => (typeof json === 'string' ? JSON.parse(json) : json) as { signatureId: number };
  const approvedEventOf = new Map(approvedEvents.map((e) => [e.entity_id, after(e.after_json)]));
  const signatures = (await db('signatures').where({ meaning: 'approved' }).select('id', 'version_id')) as { id: number; version_id: number }[];
  const signatureOf = new Map(signatures.map((s) => [s.version_id, s.id]));
  const released = (await db('recipe_versions').whereIn('status', ['approved', 'superseded', 'withdrawn']).select('id', 'recipe_id', 'version', 'status')) as {
    id: number;
    recipe_id: number;
    version: number;
    status: string;
  }[];

  const unsigned = released.filter((v) => !signatureOf.has(v.id) || approvedEventOf.get(v.id)?.signatureId !== signatureOf.get(v.id));
  list.add(
    'every approved version has its signature and its recipe.version_approved event',
    unsigned.length === 0,
    `${released.length} released versions, ${unsigned.length} incomplete${sample(unsigned)}`,
  );

  const releasedIds = new Set(released.map((v) => v.id));
  const strays = signatures.filter((s) => !releasedIds.has(s.version_id));
  const strayEvents = approvedEvents.filter((e) => !releasedIds.has(e.entity_id));
  list.add(
    'no signature or approval event on a version that is not approved',
    strays.length === 0 && strayEvents.length === 0,
    `${strays.length} signatures, ${strayEvents.length} events`,
  );

  const supersededEvents = new Set((await events('recipe.version_superseded')).map((e) => e.entity_id));
  const silent = released.filter((v) => v.status === 'superseded' && !supersededEvents.has(v.id));
  list.add(
    'every superseded version has its recipe.version_superseded event',
    silent.length === 0,
    `${released.filter((v) => v.status === 'superseded').length} superseded, ${silent.length} without${sample(silent)}`,
  );

  const submittedEvents = new Set((await events('recipe.version_submitted')).map((e) => e.entity_id));
  const reviewed = (await db('recipe_versions').whereNot('status', 'draft').select('id')) as { id: number }[];
  const unsubmitted = reviewed.filter((v) => !submittedEvents.has(v.id));
  list.add(
    'every version past the draft has its recipe.version_submitted event',
    unsubmitted.length === 0,
    `${reviewed.length} versions, ${unsubmitted.length} without${sample(unsubmitted)}`,
  );

  const today = new Date().toISOString().slice(0, 10);
  const badCurrent = (await db('recipes as r')
    .leftJoin('recipe_versions as v', 'v.id', 'r.current_version_id')
    .whereNotNull('r.current_version_id')
    .where((q) => q.whereNot('v.status', 'approved').orWhereRaw('v.recipe_id <> r.id').orWhere('v.effective_from', '>', today))
    .select('r.id', 'v.status')) as unknown[];
  const inForce = (await db('recipe_versions')
    .where({ status: 'approved' })
    .where('effective_from', '<=', today)
    .groupBy('recipe_id')
    .havingRaw('count(*) > 1')
    .select('recipe_id')) as unknown[];
  list.add(
    'each recipe has at most one version in force, and it is the current one',
    badCurrent.length === 0 && inForce.length === 0,
    `${badCurrent.length} wrong current, ${inForce.length} with two in force${sample([...badCurrent, ...inForce])}`,
  );

  const countOf = async (q: Knex.QueryBuilder) => Number(((await q.count({ n: '*' }).first()) as { n: number }).n);
  const cuts = await countOf(db('cut_records'));
  const cutEvents = await countOf(db('trail_events').where({ event_type: 'cut.recorded' }));
  const acks = await countOf(db('acknowledgements'));
  const ackEvents = await countOf(db('trail_events').where({ event_type: 'recipe.version_acknowledged' }));
  const prints = await countOf(db('sheet_prints'));
  const printEvents = await countOf(db('trail_events').where({ event_type: 'sheet.printed' }));
  list.add(
    'cuts, acknowledgements and sheet prints each have their trail event',
    cuts === cutEvents && acks === ackEvents && prints === printEvents,
    `cuts ${cuts}/${cutEvents}, acknowledgements ${acks}/${ackEvents}, prints ${prints}/${printEvents} (rows/events)`,
  );

  const chain = await verifyChain(db);
  list.add('the trail chain verifies', chain.ok, JSON.stringify(chain).slice(0, 300));
}

export function checkFaults(list: CheckList, faults: FaultLog, records: RequestRecord[]): void {
  const db = faults.database;
  if (db) {
    const answered = db.probes.filter((p) => p.status === 503 && p.code === 'DATABASE_UNAVAILABLE');
    const slowest = Math.max(0, ...db.probes.map((p) => p.ms));
    list.add(
      'while MariaDB is down the app answers 503 DATABASE_UNAVAILABLE, within 10 s',
      db.probes.length > 0 && answered.length === db.probes.length && slowest <= 10_000,
      `${answered.length}/${db.probes.length} probes, slowest ${slowest} ms; others: ${JSON.stringify(db.probes.filter((p) => !answered.includes(p)).slice(0, 3))}`,
    );
    const recovery = db.recoveredMs === null ? null : db.recoveredMs - db.upMs;
    list.add(
      'after MariaDB is back the same app process recovers by itself within 30 s',
      recovery !== null && recovery <= 30_000 && db.appPidBefore !== null && db.appPidBefore === db.appPidAfter,
      `recovered ${recovery ?? 'never'} ms after MariaDB answered; app pid ${db.appPidBefore} → ${db.appPidAfter}`,
    );
    const later = records.filter((r) => r.kind !== 'fault-probe' && r.startMs > (db.recoveredMs ?? Infinity) + 2000 && r.status >= 200 && r.status < 300);
    list.add('people go on working after the database outage', later.length > 0, `${later.length} 2xx answers after it`);
  }
  const app = faults.app;
  if (app) {
    const later = records.filter((r) => r.startMs > app.upMs && r.method !== 'GET' && r.status >= 200 && r.status < 300);
    list.add(
      'the restarted app takes writes again (sessions kept in MariaDB)',
      later.length > 0,
      `${later.length} writes with 2xx after the restart; ${app.approvesInFlight} approvals were on their way at the kill`,
    );
  }
}

interface OutboxRow {
  id: number;
  to_address: string;
  subject: string;
  created_at: Date;
  attempts: number;
  sent_at: Date | null;
  message_id: string | null;
  sending_claimed_until: Date | null;
}

/**
 * True for a claim taken by a worker that died with it: just before the app was SIGKILLed,
 * or when MariaDB went away between the claim and the "sent" mark. Such a row becomes
 * claimable again when the claim runs out (CLAIM_MS); the soak does not wait that long.
 */
export function claimedBeforeFault(claimedUntil: Date, faults: FaultLog, t0: number): 'app' | 'database' | null {
  const claimedAt = claimedUntil.getTime() - CLAIM_MS - t0;
  // The killed process claimed before its successor started; the outage comes later, in the successor.
  if (faults.app && claimedAt <= faults.app.upMs) return 'app';
  // A batch is sent within seconds of its claim; ten seconds leaves room for a loaded machine.
  const db = faults.database;
  if (db && claimedAt >= db.downMs - 10_000 && claimedAt <= (db.recoveredMs ?? Infinity) + 2000) return 'database';
  return null;
}

/** Waits until every unsent row of the outbox is held by the claim of a worker that died with it. */
export async function waitForOutbox(db: Knex, faults: FaultLog, t0: number, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const rows = (await db('mail_outbox').whereNull('sent_at').select('sending_claimed_until')) as { sending_claimed_until: Date | null }[];
    const now = Date.now();
    if (
      rows.every((r) => r.sending_claimed_until && r.sending_claimed_until.getTime() > now && claimedBeforeFault(r.sending_claimed_until, faults, t0) !== null)
    )
      return;
    await new Promise((r) => setTimeout(r, 1000));
  }
}

export async function checkMail(list: CheckList, db: Knex, faults: FaultLog, t0: number, caught: CaughtMail[]): Promise<void> {
  const rows = (await db('mail_outbox').select(
    'id',
    'to_address',
    'subject',
    'created_at',
    'attempts',
    'sent_at',
    'message_id',
    'sending_claimed_until',
  )) as OutboxRow[];
  const now = Date.now();
  const held = rows.filter((r) => r.sent_at === null && r.sending_claimed_until && r.sending_claimed_until.getTime() > now);
  const unsent = rows.filter((r) => r.sent_at === null && !held.includes(r));
  list.add(
    'every mail in the outbox went out (or is held by the claim of a worker that died with it)',
    unsent.length === 0,
    `${rows.length} rows, ${unsent.length} unsent, ${held.length} held by a claim`,
  );

  const oddHolds = held.filter((r) => claimedBeforeFault(r.sending_claimed_until!, faults, t0) === null);
  list.add(
    'rows still held were claimed before the app crash or the database outage',
    oddHolds.length === 0,
    `${held.length} held, ${oddHolds.length} otherwise${sample(oddHolds.map((r) => r.id))}`,
  );

  // A held row whose mail the catcher already has was sent but not marked: it goes out again when its claim runs out.
  const caughtBy = new Map<string, number>();
  for (const m of caught) caughtBy.set(`${m.to.join(',')}|${m.subject}`, (caughtBy.get(`${m.to.join(',')}|${m.subject}`) ?? 0) + 1);
  for (const r of rows.filter((r) => r.sent_at !== null)) caughtBy.set(`${r.to_address}|${r.subject}`, (caughtBy.get(`${r.to_address}|${r.subject}`) ?? 0) - 1);
  const delivered = held.filter((r) => {
    const k = `${r.to_address}|${r.subject}`;
    const n = caughtBy.get(k) ?? 0;
    if (n > 0) caughtBy.set(k, n - 1);
    return n > 0;
  });
  const byFault = (list: OutboxRow[], fault: 'app' | 'database') =>
    list.filter((r) => claimedBeforeFault(r.sending_claimed_until!, faults, t0) === fault).length;
  if (faults.database) {
    const n = byFault(delivered, 'database');
    list.add(
      'no mail delivered but left unmarked by the database outage (it would go out twice)',
      n === 0,
      `${byFault(held, 'database')} rows held by a claim from the outage, ${n} of them already delivered`,
    );
  }
  if (faults.app) {
    // A process killed between the SMTP server's answer and the "sent" mark cannot tell its successor; reported, not checked.
    console.log(
      `       note: ${byFault(held, 'app')} rows held by the killed process's claim, ${byFault(delivered, 'app')} of them already delivered (at-least-once across a SIGKILL)`,
    );
  }

  const byId = new Map<string, number>();
  for (const m of caught) byId.set(m.messageId ?? '', (byId.get(m.messageId ?? '') ?? 0) + 1);
  const sent = rows.filter((r) => r.sent_at !== null);
  const notOnce = sent.filter((r) => byId.get(r.message_id ?? '') !== 1);
  const twice = [...byId].filter(([, n]) => n > 1);
  list.add(
    'every sent mail was caught exactly once',
    notOnce.length === 0 && twice.length === 0,
    `${sent.length} sent, ${caught.length} caught, ${notOnce.length} not once, ${twice.length} message ids twice`,
  );

  const mail = faults.mail;
  if (mail) {
    const waited = rows.filter((r) => r.created_at.getTime() - t0 >= mail.downMs && r.created_at.getTime() - t0 < mail.upMs);
    const deliveredAfter = waited.filter((r) => r.sent_at !== null && r.sent_at.getTime() - t0 >= mail.upMs);
    list.add(
      'mail written while SMTP was down waited in the outbox and went out after it came back',
      waited.length > 0 && deliveredAfter.length + waited.filter((r) => held.includes(r)).length === waited.length,
      `${waited.length} written during the outage, ${deliveredAfter.length} sent after it, ${waited.filter((r) => r.attempts > 0).length} after failed attempts`,
    );
  }
}
