/**
 * The library's text search: every word of the query must start a word of the recipe's
 * search text (number, title, material name, designation), which the database keeps as
 * " word word…" (migration 20270201090000). Words long enough for the server's FULLTEXT
 * index are matched there (an index lookup); shorter or longer ones — MariaDB's default
 * minimum is 3, `npm start` sets 1 — and every word of a search the caller narrows by
 * another index are matched by LIKE '% word%' on the rows already chosen.
 */
import type { Knex } from 'knex';

/** At most this many words are searched; the rest of a pasted paragraph is ignored. */
const MAX_WORDS = 8;

/** Words as InnoDB's FULLTEXT parser cuts them: letters, digits and underscores. */
export function searchWords(q: string): string[] {
  const words = q.toLowerCase().split(/[^\p{L}\p{N}_]+/u).filter(Boolean);
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

export interface TokenSizes {
  min: number;
  max: number;
}

const tokenSizes = new WeakMap<Knex, Promise<TokenSizes>>();

/** The server's FULLTEXT word lengths, read once per connection pool. */
function readTokenSizes(db: Knex): Promise<TokenSizes> {
  let sizes = tokenSizes.get(db);
  if (!sizes) {
    sizes = db
      .raw('SELECT @@innodb_ft_min_token_size AS min, @@innodb_ft_max_token_size AS max')
      .then(([rows]: [{ min: number; max: number }[]]) => ({ min: Number(rows[0]!.min), max: Number(rows[0]!.max) }));
    sizes.catch(() => tokenSizes.delete(db));
    tokenSizes.set(db, sizes);
  }
  return sizes;
}

/**
 * The search on `column` (which has a FULLTEXT index) as a condition to add to queries;
 * a query without words adds nothing. `byIndex` false: the query is narrowed by another
 * index (group and machine), and reading those rows beats collecting every match.
 */
export async function wordsMatch(db: Knex, column: string, q: string, byIndex = true): Promise<(query: Knex.QueryBuilder) => void> {
  const words = searchWords(q);
  if (words.length === 0) return () => {};
  return wordsCondition(column, words, byIndex ? await readTokenSizes(db) : NO_INDEX);
}

/** Token sizes that no word has: every word by LIKE. */
const NO_INDEX: TokenSizes = { min: Infinity, max: 0 };

/** The condition for `words` on a server whose index holds words of `sizes`. */
export function wordsCondition(column: string, words: readonly string[], sizes: TokenSizes): (query: Knex.QueryBuilder) => void {
  const indexed = words.filter((w) => w.length >= sizes.min && w.length <= sizes.max);
  const others = words.filter((w) => !indexed.includes(w));
  return (query) => {
    if (indexed.length > 0) query.whereRaw('MATCH(??) AGAINST (? IN BOOLEAN MODE)', [column, booleanQuery(indexed)]);
    for (const w of others) query.where(column, 'like', wordStartPattern(w));
  };
}
