/**
 * The two database accounts: an owner that runs the migrations (tables, indexes, triggers)
 * and the app's account, which reads and writes rows only. With the app on its own account,
 * whoever holds the app's password cannot drop the triggers that guard the records, change
 * rows behind them and make the triggers again. See README.md, "Database accounts".
 */
import type { Knex } from 'knex';

/** All the app needs: it makes no tables, locks or routines at run time. */
export const APP_PRIVILEGES = ['SELECT', 'INSERT', 'UPDATE', 'DELETE'] as const;

/** Privileges that change the schema, its triggers or who may do what. */
const SCHEMA_CHANGING = new Set([
  'ALL PRIVILEGES',
  'ALTER',
  'ALTER ROUTINE',
  'CREATE',
  'CREATE ROUTINE',
  'CREATE VIEW',
  'DROP',
  'EVENT',
  'GRANT OPTION',
  'INDEX',
  'SUPER',
  'TRIGGER',
]);

const quoteName = (name: string): string => `\`${name.replace(/`/g, '``')}\``;
const quoteText = (text: string): string => `'${text.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

export interface AccountNames {
  database: string;
  owner: string;
  app: string;
  /** The host part of both accounts, e.g. 127.0.0.1 or '%'. */
  host: string;
}

/** The GRANT statements for both accounts (the accounts themselves must exist). */
export function grantStatements(a: AccountNames): string[] {
  const on = `${quoteName(a.database)}.*`;
  return [
    `GRANT ALL PRIVILEGES ON ${on} TO ${quoteText(a.owner)}@${quoteText(a.host)}`,
    `GRANT ${APP_PRIVILEGES.join(', ')} ON ${on} TO ${quoteText(a.app)}@${quoteText(a.host)}`,
  ];
}

/**
 * The schema-changing privileges the connection's account holds on its database (directly,
 * on every database, or through a database pattern). Empty for the app's account as set up
 * by `npm start`; its owner account has ALL PRIVILEGES.
 */
export async function schemaPrivileges(db: Knex): Promise<string[]> {
  const [[me]] = (await db.raw('SELECT CURRENT_USER() AS who, DATABASE() AS db')) as [{ who: string; db: string | null }[]];
  const at = me!.who.lastIndexOf('@');
  const grantee = `'${me!.who.slice(0, at)}'@'${me!.who.slice(at + 1)}'`;
  const [rows] = (await db.raw(
    `SELECT PRIVILEGE_TYPE AS p FROM information_schema.USER_PRIVILEGES WHERE GRANTEE = ?
     UNION SELECT PRIVILEGE_TYPE FROM information_schema.SCHEMA_PRIVILEGES WHERE GRANTEE = ? AND ? LIKE TABLE_SCHEMA`,
    [grantee, grantee, me!.db ?? ''],
  )) as [{ p: string }[]];
  return [...new Set(rows.map((r) => r.p).filter((p) => SCHEMA_CHANGING.has(p)))].sort();
}

/** The start-up warning when the server's account could drop the triggers; null when it cannot. */
export async function schemaChangeWarning(db: Knex): Promise<string | null> {
  const held = await schemaPrivileges(db);
  if (held.length === 0) return null;
  return (
    `The app's database account (DATABASE_URL) can change the schema (${held.join(', ')}): whoever has its password can drop ` +
    'the triggers that keep signed versions, signatures and the trail unchanged. Give the app an account that may only ' +
    'SELECT, INSERT, UPDATE and DELETE, and run the migrations with an owner account in MIGRATION_DATABASE_URL ' +
    '(README.md, "Database accounts").'
  );
}
