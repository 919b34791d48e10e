/**
 * InnoDB picks a victim when two transactions wait on each other's index locks (e.g. one
 * worker's SKIP LOCKED scan of an index while another marks a row sent, which moves it in
 * that index) and rolls it back with ER_LOCK_DEADLOCK. The victim's work is undone whole,
 * so running it again is safe; MariaDB's manual says to retry.
 */
const DEADLOCK_CODES = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);

export function isDeadlock(err: unknown): boolean {
  return typeof err === 'object' && err !== null && DEADLOCK_CODES.has(String((err as { code?: unknown }).code));
}

/** Runs `work` (one whole transaction or statement) again after a deadlock, up to `attempts` times. */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (err) {
      if (!isDeadlock(err) || attempt >= attempts) throw err;
      // A short, growing, jittered pause so the two do not collide again at once.
      await new Promise((r) => setTimeout(r, attempt * 20 + Math.random() * 30));
    }
  }
}
