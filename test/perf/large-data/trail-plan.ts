/**
 * The trail of the large data set, planned before it is written: every change the data set
 * holds adds an event at its moment, and the rows are built only when the plan is written
 * in time order. Ids of recipes, versions, signatures, cuts … are handed out while the
 * events are built, so — as in the running app — they grow with time.
 */
import type { TrailEntityType, TrailEventType } from '../../../server/services/trail/event-types';
import type { Person } from './people';

export interface TrailActor {
  userId: number | null;
  name: string;
  clientAddress: string;
}

/** What `appendTrailEvent` is given, with the recipe resolved (it looks it up; the plan knows it). */
export interface TrailEntry {
  type: TrailEventType;
  entityType: TrailEntityType;
  entityId: number | null;
  recipeId: number | null;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
}

export interface PlannedEvent {
  /** Milliseconds since the epoch. */
  t: number;
  /** Order of planning: breaks ties, so events of one action keep their order. */
  seq: number;
  actor: TrailActor;
  make: () => TrailEntry;
}

export function actorOf(person: Person): TrailActor {
  return { userId: person.id, name: person.displayName, clientAddress: person.clientAddress };
}

export class TrailPlan {
  private readonly events: PlannedEvent[] = [];

  add(t: number, actor: TrailActor, make: () => TrailEntry): void {
    this.events.push({ t: Math.floor(t), seq: this.events.length, actor, make });
  }

  get size(): number {
    return this.events.length;
  }

  /** Oldest first; events at the same millisecond in the order they were planned. */
  inTimeOrder(): PlannedEvent[] {
    return this.events.sort((a, b) => a.t - b.t || a.seq - b.seq);
  }
}

/** Hands out ids 1, 2, 3 … in the order asked. */
export class IdSequence {
  private last = 0;

  next(): number {
    this.last += 1;
    return this.last;
  }

  get count(): number {
    return this.last;
  }
}
