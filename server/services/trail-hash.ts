/**
 * The chain migration (migrations/20261215090000_chain_audit_events.ts) imports the hash
 * from this path, and a migration that has landed is never edited: the definition lives in
 * trail/hash.ts. Delete this file once no migration imports it.
 */
export { GENESIS_HASH, trailHash } from './trail/hash';
