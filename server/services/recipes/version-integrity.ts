/**
 * Is a version's content still what was submitted and signed? Its SHA-256 is recomputed
 * from the stored canonical text on every read, compare and print, and held against the
 * hash fixed at submission and the hash each signature binds (21 CFR 11.70: signatures
 * linked to their records so they cannot be transferred to falsify one). Someone with
 * database access who rewrites the content, or re-signs it by writing rows, is seen here.
 */
import { createHash } from 'node:crypto';
import type { VersionIntegrityDto } from '../../../shared/recipe-types';
import type { SignatureMeaning } from '../../../shared/schemas/workflow';
import type { RecipeStatus } from '../../../shared/vocabulary';

/** SHA-256 (hex) of the stored canonical content text: exactly the bytes a signature binds. */
export function contentSha256(contentJson: string): string {
  return createHash('sha256').update(contentJson, 'utf8').digest('hex');
}

/** Statuses a version reaches only through an approval signature. */
const SIGNED_STATUSES: readonly RecipeStatus[] = ['approved', 'superseded', 'withdrawn'];

const short = (hash: string | null) => (hash ?? '').slice(0, 16);

export interface IntegrityInput {
  content_json: string;
  content_hash: string | null;
  status: RecipeStatus;
}

export interface SignedHash {
  signer_name: string;
  meaning: SignatureMeaning;
  signed_at: Date | string;
  content_hash: string;
}

export function versionIntegrity(row: IntegrityInput, signatures: readonly SignedHash[]): VersionIntegrityDto {
  const actual = contentSha256(row.content_json);
  const problems: string[] = [];
  if (row.content_hash !== null && row.content_hash !== actual) {
    problems.push(
      `The content no longer matches the hash fixed when it was submitted (${short(row.content_hash)}…; the content now hashes to ${short(actual)}…).`,
    );
  }
  for (const s of signatures) {
    if (s.content_hash !== actual) {
      const at = new Date(s.signed_at).toISOString().slice(0, 16).replace('T', ' ');
      problems.push(
        `${s.signer_name}'s signature (${s.meaning}, ${at} UTC) binds content ${short(s.content_hash)}…, not the content stored now (${short(actual)}…).`,
      );
    }
  }
  if (SIGNED_STATUSES.includes(row.status) && !signatures.some((s) => s.meaning === 'approved')) {
    problems.push(`The version is ${row.status} but carries no approval signature.`);
  }
  return { ok: problems.length === 0, problems };
}
