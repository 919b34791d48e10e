import { AppError } from '../../app-error';

/** When a refused attempt may be tried again, in the words and header every limiter answers with. */
export interface RetryAt {
  /** Whole minutes until then, at least 1. */
  minutes: number;
  /** "14:05": the UTC time of day it lifts. */
  at: string;
}

/** 429 TOO_MANY_ATTEMPTS with Retry-After, its message written from when the limit lifts. */
export function tooManyAttempts(until: Date, now: Date, message: (retry: RetryAt) => string): AppError {
  const seconds = Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 1000));
  const retry = { minutes: Math.ceil(seconds / 60), at: until.toISOString().slice(11, 16) };
  return new AppError(429, 'TOO_MANY_ATTEMPTS', [{ path: '', message: message(retry) }], { headers: { 'Retry-After': String(seconds) } });
}

/** "1 minute", "12 minutes". */
export const minutesText = (minutes: number) => `${minutes} minute${minutes === 1 ? '' : 's'}`;
