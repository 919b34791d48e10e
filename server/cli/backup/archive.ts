/**
 * A backup is one .tar.gz holding manifest.json and dump.sql, made and read with the
 * system's tar (GNU tar on Debian). Reading extracts only those two names into a fresh
 * temporary folder and accepts only regular files, so a hostile archive cannot write
 * elsewhere or point us at other files.
 */
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { DUMP_FILE, MANIFEST_FILE, manifestSchema, type Manifest } from './manifest';

const exec = promisify(execFile);

export class NotABackupError extends Error {}

export function tempFolder(label: string): string {
  return fs.mkdtempSync(path.join(os.tmpdir(), `kerfbook-${label}-`));
}

export async function packBackup(folder: string, file: string): Promise<void> {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const partial = `${file}.partial`;
  await exec('tar', ['-czf', partial, '-C', folder, MANIFEST_FILE, DUMP_FILE]);
  // Renamed only once whole: an interrupted backup never looks like a finished one.
  fs.renameSync(partial, file);
}

export async function sha256OfFile(file: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of fs.createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

export interface OpenedBackup {
  manifest: Manifest;
  dumpFile: string;
  folder: string;
}

/** Unpacks and checks a backup: ours, whole, and its dump exactly the one the manifest describes. */
export async function openBackup(file: string): Promise<OpenedBackup> {
  if (!fs.existsSync(file)) throw new NotABackupError(`There is no file ${file}.`);
  if (!fs.statSync(file).isFile()) throw new NotABackupError(`${file} is not a file.`);
  const folder = tempFolder('restore');
  const fail = (why: string): never => {
    fs.rmSync(folder, { recursive: true, force: true });
    throw new NotABackupError(`${file} is not a Kerfbook backup: ${why}`);
  };
  try {
    await exec('tar', ['-xzf', path.resolve(file), '-C', folder, '--no-same-owner', '--no-same-permissions', MANIFEST_FILE, DUMP_FILE]);
  } catch {
    return fail(`it is not a .tar.gz holding ${MANIFEST_FILE} and ${DUMP_FILE}, or it is damaged.`);
  }
  const manifestPath = path.join(folder, MANIFEST_FILE);
  const dumpFile = path.join(folder, DUMP_FILE);
  if (![manifestPath, dumpFile].every((p) => fs.lstatSync(p).isFile())) return fail('its members are not plain files.');
  let manifest: Manifest;
  try {
    manifest = manifestSchema.parse(JSON.parse(fs.readFileSync(manifestPath, 'utf8')));
  } catch {
    return fail(`${MANIFEST_FILE} is not a Kerfbook backup manifest.`);
  }
  const bytes = fs.statSync(dumpFile).size;
  if (bytes !== manifest.dump.bytes || (await sha256OfFile(dumpFile)) !== manifest.dump.sha256) {
    return fail(`${DUMP_FILE} is damaged (its size or SHA-256 differs from the manifest).`);
  }
  return { manifest, dumpFile, folder };
}
