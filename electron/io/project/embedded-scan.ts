// A scan embedded in the project file: the scan's original bytes in base64 with
// their SHA-256, so a project still opens with its scans when it is moved without
// them, and a copy damaged in the file (a bad sync, a hand edit) is told apart
// from the scan by its digest instead of being traced as a different picture.
import { createHash } from 'node:crypto';
import type { EmbeddedScan } from './project-schema.ts';

/** SHA-256 of `bytes`, lowercase hex (FIPS 180-4, through node:crypto). */
export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** The embedded copy of a scan whose file holds `bytes`. */
export function embedScan(bytes: Uint8Array): EmbeddedScan {
  return { sha256: sha256Hex(bytes), base64: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('base64') };
}

/**
 * The scan's bytes from its embedded copy, or undefined when they do not match the
 * copy's SHA-256 (the copy is damaged). The base64 spelling has been checked by the
 * project schema.
 */
export function embeddedScanBytes(embedded: EmbeddedScan): Uint8Array | undefined {
  const bytes = new Uint8Array(Buffer.from(embedded.base64, 'base64'));
  return sha256Hex(bytes) === embedded.sha256 ? bytes : undefined;
}
