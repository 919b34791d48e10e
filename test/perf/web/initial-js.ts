/**
 * The JavaScript a first visit downloads before the app can start: the files index.html
 * loads eagerly (the module script and its modulepreload links). Lazy route chunks are not
 * counted. Sizes are raw and gzip at zlib's default level, which the server's compression
 * middleware also uses.
 */
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

export interface InitialFile {
  file: string;
  rawBytes: number;
  gzipBytes: number;
}

export interface InitialJs {
  files: InitialFile[];
  rawBytes: number;
  gzipBytes: number;
}

/** Script and modulepreload addresses named in index.html, in document order. */
export function eagerScripts(indexHtml: string): string[] {
  const found: string[] = [];
  const tag = /<(script|link)\b[^>]*>/gi;
  for (const [element, name] of indexHtml.matchAll(tag)) {
    const attr = (key: string) => new RegExp(`\\b${key}\\s*=\\s*["']?([^"'\\s>]+)`, 'i').exec(element)?.[1];
    const url = name.toLowerCase() === 'script' ? attr('src') : attr('rel') === 'modulepreload' ? attr('href') : undefined;
    if (url && !found.includes(url)) found.push(url);
  }
  return found;
}

export function measureInitialJs(browserDir: string): InitialJs {
  const html = fs.readFileSync(path.join(browserDir, 'index.html'), 'utf8');
  const files = eagerScripts(html).map((url) => {
    const bytes = fs.readFileSync(path.join(browserDir, url.replace(/^\//, '')));
    return { file: url, rawBytes: bytes.length, gzipBytes: gzipSync(bytes).length };
  });
  const sum = (key: 'rawBytes' | 'gzipBytes') => files.reduce((n, f) => n + f[key], 0);
  return { files, rawBytes: sum('rawBytes'), gzipBytes: sum('gzipBytes') };
}

/** The `initial` budget's maximumError in angular.json, in bytes (Angular counts raw bytes, kB = 1000). */
export function initialBudgetBytes(angularJson: string): number | null {
  const config = JSON.parse(fs.readFileSync(angularJson, 'utf8')) as {
    projects: Record<string, { architect?: { build?: { configurations?: { production?: { budgets?: { type: string; maximumError?: string }[] } } } } }>;
  };
  for (const project of Object.values(config.projects)) {
    const budget = project.architect?.build?.configurations?.production?.budgets?.find((b) => b.type === 'initial');
    const match = budget?.maximumError && /^([\d.]+)\s*(b|kb|mb)$/i.exec(budget.maximumError);
    if (match) return Number(match[1]) * { b: 1, kb: 1000, mb: 1000 * 1000 }[match[2]!.toLowerCase() as 'b' | 'kb' | 'mb'];
  }
  return null;
}
