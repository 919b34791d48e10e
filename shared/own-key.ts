/**
 * A lookup in a table by a key from outside (a query value, a stored code): only the table's
 * own keys count. `table[key]` would find "constructor", "toString" or "__proto__" on every
 * object and hand back a function where a missing entry was meant.
 */
export function ownValue<V>(table: Readonly<Record<string, V>>, key: string): V | undefined {
  return Object.hasOwn(table, key) ? table[key] : undefined;
}
