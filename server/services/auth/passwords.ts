/**
 * Password hashing with node:crypto scrypt (memory-hard). Hashes are stored as a
 * self-describing string, `scrypt$N=32768,r=8,p=1$<salt>$<key>` (base64url), so the cost
 * can be raised later while old hashes still verify.
 */
import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

const CURRENT = { N: 2 ** 15, r: 8, p: 1 };
const SALT_BYTES = 16;
const KEY_BYTES = 32;

/**
 * Hashes running at once. scrypt runs on libuv's thread pool (4 threads unless
 * UV_THREADPOOL_SIZE says otherwise), which the gzip of every compressed answer shares: a
 * burst of sign-ins queued there held every other answer back for seconds (the soak run's
 * shift start, 200 sign-ins at once). Further hashes wait their turn here instead.
 */
const PARALLEL_HASHES = 2;
let hashing = 0;
const waitingToHash: (() => void)[] = [];

async function scryptAsync(password: string, salt: Buffer, params: typeof CURRENT): Promise<Buffer> {
  // scrypt needs 128·N·r bytes; the default maxmem (32 MiB) is exactly that at N=2^15, r=8
  // and is refused, so allow twice the requirement.
  const options: ScryptOptions = { ...params, maxmem: 256 * params.N * params.r };
  // A finished hash hands its place straight to the next one waiting.
  if (hashing < PARALLEL_HASHES) hashing += 1;
  else await new Promise<void>((resolve) => waitingToHash.push(resolve));
  try {
    return await new Promise((resolve, reject) => scrypt(password, salt, KEY_BYTES, options, (err, key) => (err ? reject(err) : resolve(key))));
  } finally {
    const next = waitingToHash.shift();
    if (next) next();
    else hashing -= 1;
  }
}

/** Unicode passwords typed on different keyboards may arrive composed or decomposed. */
function normalise(password: string): string {
  return password.normalize('NFC');
}

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(SALT_BYTES);
  const key = await scryptAsync(normalise(password), salt, CURRENT);
  const { N, r, p } = CURRENT;
  return `scrypt$N=${N},r=${r},p=${p}$${salt.toString('base64url')}$${key.toString('base64url')}`;
}

interface ParsedHash {
  params: typeof CURRENT;
  salt: Buffer;
  key: Buffer;
}

function parseHash(stored: string): ParsedHash | null {
  const parts = stored.split('$');
  if (parts.length !== 4 || parts[0] !== 'scrypt') return null;
  const params = Object.fromEntries(
    parts[1]!.split(',').map((kv) => {
      const [k, v] = kv.split('=');
      return [k, Number(v)];
    }),
  ) as Record<string, number>;
  const { N, r, p } = params;
  if (!N || !r || !p || !Number.isInteger(N) || N > 2 ** 20 || r > 32 || p > 16) return null;
  const salt = Buffer.from(parts[2]!, 'base64url');
  const key = Buffer.from(parts[3]!, 'base64url');
  if (salt.length === 0 || key.length === 0) return null;
  return { params: { N, r, p }, salt, key };
}

/** True when `password` matches the stored hash. A malformed hash never matches. */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const parsed = parseHash(stored);
  if (!parsed) return false;
  const key = await scryptAsync(normalise(password), parsed.salt, parsed.params);
  return key.length === parsed.key.length && timingSafeEqual(key, parsed.key);
}

/** True when the hash was made with other parameters than today's (rehash at next sign-in). */
export function needsRehash(stored: string): boolean {
  const parsed = parseHash(stored);
  return !parsed || parsed.params.N !== CURRENT.N || parsed.params.r !== CURRENT.r || parsed.params.p !== CURRENT.p;
}

/**
 * A hash of a random secret, verified against when the username is unknown so that
 * unknown and known names take the same time to refuse.
 */
let decoy: Promise<string> | null = null;
export function decoyHash(): Promise<string> {
  decoy ??= hashPassword(randomBytes(18).toString('base64url'));
  return decoy;
}
