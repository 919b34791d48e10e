/**
 * The app's background jobs (supersession, review reminders, mail) run the same way: now,
 * then every `intervalMs` until stopped; runs never overlap in one process (the next tick
 * is skipped while one is still going); a failed run is logged and tried again next time.
 * The timers are unref'd so they never keep a process alive on their own.
 */
export function startRepeatingJob(
  name: string,
  job: () => Promise<unknown>,
  intervalMs: number,
  log: (...args: unknown[]) => void = console.error,
): () => void {
  let running = false;
  let stopped = false;
  const run = async () => {
    if (running || stopped) return;
    running = true;
    try {
      await job();
    } catch (err) {
      log(`[${name}] run failed:`, err instanceof Error ? err.message : err);
    } finally {
      running = false;
    }
  };
  const first = setTimeout(() => void run(), 0);
  const timer = setInterval(() => void run(), intervalMs);
  first.unref();
  timer.unref();
  return () => {
    stopped = true;
    clearTimeout(first);
    clearInterval(timer);
  };
}
