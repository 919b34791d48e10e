/**
 * The library's text search: every word of the query must start a word of the recipe's
 * search text (number, title, material name, designation), which the database keeps as
 * " word word…" (migration 20261202030504). Words long enough for the server's FULLTEXT
 * index are matched there (an index lookup); shorter or longer ones — MariaDB's default
 * minimum is 3, `npm start` sets 1 — the server's stopwords (none in `npm start`'s), and
 * every word of a search the caller narrows by another index are matched by
 * LIKE '% word%' on the rows already chosen.
 */
import type { Knex } from 'knex';

/** At most this many words are searched; the rest of a pasted paragraph is ignored. */
const MAX_WORDS = 8;

/** Words as InnoDB's FULLTEXT parser cuts them: letters, digits and underscores. */
export function searchWords(q: string): string[] {
  const words = q
    .toLowerCase()
    .split(/[^\p{L}\p{N}_]+/u)
    .filter(Boolean);
  return [...new Set(words)].slice(0, MAX_WORDS);
}

/** `+word*` for each word: all must be there, each as the start of a word. */
export function booleanQuery(words: readonly string[]): string {
  return words.map((w) => `+${w}*`).join(' ');
}

/** A LIKE pattern for `word` at the start of a word of the kept text (" word word…"). */
export function wordStartPattern(word: string): string {
  return `% ${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** What the server's FULLTEXT index holds: words of these lengths, less its stopwords. */
export interface IndexedWords {
  min: number;
  max: number;
  /** Left out of the index when the server builds it (TRUNCATE and restores rebuild it). */
  stopwords: readonly string[];
}

const indexedWords = new WeakMap<Knex, Promise<IndexedWords>>();

interface ServerSettings {
  min: number;
  max: number;
  enabled: number;
  serverTable: string | null;
  userTable: string | null;
}

/**
 * The server's FULLTEXT settings, read once per connection pool. With stopwords on, any
 * index rebuild leaves them out (whatever the migration's own session said), so they are
 * searched by LIKE: the default list, plus a configured table's ("db/table").
 */
function readIndexedWords(db: Knex): Promise<IndexedWords> {
  let found = indexedWords.get(db);
  if (!found) {
    found = (async () => {
      const [[settings]] = (await db.raw(
        `SELECT @@innodb_ft_min_token_size AS min, @@innodb_ft_max_token_size AS max, @@innodb_ft_enable_stopword AS enabled,
                @@innodb_ft_server_stopword_table AS serverTable, @@innodb_ft_user_stopword_table AS userTable`,
      )) as [ServerSettings[]];
      const stopwords: string[] = [];
      if (Number(settings!.enabled) === 1) {
        const [defaults] = (await db.raw('SELECT value FROM information_schema.INNODB_FT_DEFAULT_STOPWORD')) as [{ value: string }[]];
        stopwords.push(...defaults.map((r) => r.value));
        for (const table of [settings!.serverTable, settings!.userTable]) {
          if (!table) continue;
          const [rows] = (await db.raw('SELECT value FROM ??', [table.replace('/', '.')])) as [{ value: string }[]];
          stopwords.push(...rows.map((r) => r.value));
        }
      }
      return { min: Number(settings!.min), max: Number(settings!.max), stopwords: stopwords.map((w) => w.toLowerCase()) };
    })();
    found.catch(() => indexedWords.delete(db));
    indexedWords.set(db, found);
  }
  return found;
}

/**
 * The search on `column` (which has a FULLTEXT index) as a condition to add to queries;
 * a query without words adds nothing. `byIndex` false: the query is narrowed by another
 * index (group and machine), and reading those rows beats collecting every match.
 */
export async function wordsMatch(db: Knex, column: string, q: string, byIndex = true): Promise<(query: Knex.QueryBuilder) => void> {
  const words = searchWords(q);
  if (words.length === 0) return () => {};
  return wordsCondition(column, words, byIndex ? await readIndexedWords(db) : NO_INDEX);
}

/** An index that holds no word: every word by LIKE. */
const NO_INDEX: IndexedWords = { min: Infinity, max: 0, stopwords: [] };

/**
 * The condition for `words` on a server whose index holds `index`. A word that starts a
 * stopword ("th" of "the") goes by LIKE too: the index could not find the stopword itself.
 */
export function wordsCondition(column: string, words: readonly string[], index: IndexedWords): (query: Knex.QueryBuilder) => void {
  const indexed = words.filter((w) => w.length >= index.min && w.length <= index.max && !index.stopwords.some((s) => s.startsWith(w)));
  const others = words.filter((w) => !indexed.includes(w));
  return (query) => {
    if (indexed.length > 0) query.whereRaw('MATCH(??) AGAINST (? IN BOOLEAN MODE)', [column, booleanQuery(indexed)]);
    for (const w of others) query.where(column, 'like', wordStartPattern(w));
  };
}
