/** A JSON column's value: mysql2 parses MariaDB JSON columns itself, or hands back text. */
export function fromJsonColumn<T>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}
