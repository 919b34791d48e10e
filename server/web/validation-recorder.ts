/**
 * Which schema validated which part of each request: off unless a test switches it on, so
 * a test can prove that every route validates exactly what its line in the route table
 * declares (and the API reference documents), and nothing else.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import type { z } from 'zod';
import type { HttpMethod, RequestPart } from './route-definition';

export interface AppliedSchema {
  part: RequestPart;
  schema: z.ZodType;
}

/** One request as the recorder saw it. */
export interface RecordedRequest {
  method: HttpMethod;
  /** The route table's path (with its :params), not the concrete one. */
  routePath: string;
  applied: AppliedSchema[];
}

const current = new AsyncLocalStorage<RecordedRequest>();
const recordings = new Set<RecordedRequest[]>();

/** Starts a recording (tests only): every request that gets past access is added to `requests` until `stop()`. */
export function startValidationRecording(): { requests: RecordedRequest[]; stop(): void } {
  const requests: RecordedRequest[] = [];
  recordings.add(requests);
  return { requests, stop: () => recordings.delete(requests) };
}

/** Runs one request's validation and handler, recorded while a recording is on. */
export function withinRecordedRequest<T>(method: HttpMethod, routePath: string, run: () => T): T {
  if (recordings.size === 0) return run();
  const entry: RecordedRequest = { method, routePath, applied: [] };
  for (const requests of recordings) requests.push(entry);
  return current.run(entry, run);
}

/** Notes that `schema` validated `part` of the request being handled, if recording. */
export function noteValidation(part: RequestPart, schema: z.ZodType): void {
  current.getStore()?.applied.push({ part, schema });
}
