// The scan as the project file embeds it, made in the page: a scan opened in the
// browser has no path the host could read it from, so its bytes travel inside the
// project (base64 with their SHA-256, the project schema's embedded copy), and an
// opened project's scan comes back the same way.
import type { EmbeddedScan } from '../../../electron/io/project/project-schema.ts';

/** Bytes per String.fromCharCode call: well under every engine's argument limit (common practice). */
const BASE64_CHUNK_BYTES = 0x8000;

const copies = new WeakMap<Blob, Promise<EmbeddedScan>>();

/** Bytes as standard base64, built in chunks so a scan of tens of MiB converts. */
export function toBase64(bytes: Uint8Array): string {
  let binary = '';
  for (let start = 0; start < bytes.length; start += BASE64_CHUNK_BYTES) {
    binary += String.fromCharCode(...bytes.subarray(start, start + BASE64_CHUNK_BYTES));
  }
  return btoa(binary);
}

function hex(digest: ArrayBuffer): string {
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}

/** The embedded copy of `file` (SHA-256 by the page's Web Crypto, FIPS 180-4); computed once per file. */
export function embeddedCopyOf(file: Blob): Promise<EmbeddedScan> {
  let copy = copies.get(file);
  if (!copy) {
    copy = file.arrayBuffer().then(async (buffer) => ({ sha256: hex(await crypto.subtle.digest('SHA-256', buffer)), base64: toBase64(new Uint8Array(buffer)) }));
    copies.set(file, copy);
  }
  return copy;
}

/** The scan file an embedded copy holds, named `name`; its copy is remembered so saving does not recompute it. */
export function fileFromCopy(copy: EmbeddedScan, name: string): File {
  const binary = atob(copy.base64);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  const file = new File([bytes], name);
  copies.set(file, Promise.resolve(copy));
  return file;
}
