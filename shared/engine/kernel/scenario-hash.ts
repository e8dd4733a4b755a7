import canonicalize from 'canonicalize';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import type { Scenario } from '../../contracts/scenario.ts';

/** Fields that label a scenario without changing any number it produces. */
const LABEL_FIELDS = ['title', 'description'] as const;

/**
 * Hex SHA-256 of the RFC 8785 canonical JSON of the parsed scenario (defaults filled in), with
 * the label fields `title` and `description` left out, so two documents that mean the same run
 * hash alike however their keys are ordered or whether defaults were written out.
 */
export function scenarioHash(scenario: Scenario): string {
  const copy: Record<string, unknown> = { ...scenario };
  for (const key of LABEL_FIELDS) delete copy[key];
  const text = canonicalize(copy);
  if (text === undefined) throw new Error('scenario could not be canonicalised');
  return bytesToHex(sha256(utf8ToBytes(text)));
}
