/** A revision's id: the SHA-256 (hex) of the design's canonical JSON (core/canonical-json.ts). */
import { createHash } from 'node:crypto';
import { canonicalJson } from '../core/index.ts';

export function revisionIdOfCanonical(canonical: string): string {
  return createHash('sha256').update(canonical, 'utf8').digest('hex');
}

export function revisionId(design: unknown): string {
  return revisionIdOfCanonical(canonicalJson(design));
}
