/** No look-alike characters (0/O, 1/l/I), since the admin reads it out or writes it down. */
const ALPHABET = 'abcdefghijkmnpqrstuvwxyzABCDEFGHJKLMNPQRSTUVWXYZ23456789';

/** A random 14-character temporary password from the browser's CSPRNG. */
export function suggestTemporaryPassword(length = 14): string {
  const bytes = new Uint32Array(length);
  crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => ALPHABET[b % ALPHABET.length]).join('');
}
