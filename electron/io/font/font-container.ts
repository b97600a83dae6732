// Recognises what kind of file a font file is from its first bytes, and whether it
// is complete, before any parser sees it — so that a user who picks a WOFF2 file, a
// font collection, a truncated download or something that is not a font at all is
// told exactly that, instead of a parser's internal error.
import { InputError } from '../input-error.ts';
import { readTableRecords, SFNT_VERSION_CFF, SFNT_VERSION_TRUETYPE, tablesOutsideFile } from './sfnt-tables.ts';

export type FontContainer = 'sfnt' | 'woff';

/** File signatures (OpenType spec, table directory sfntVersion; W3C WOFF 1.0 and WOFF 2.0, "WOFF Header"; OpenType spec, "Font Collections"). */
const SIGNATURE = {
  otto: SFNT_VERSION_CFF,
  trueType: SFNT_VERSION_TRUETYPE,
  /** 'true', the old Apple TrueType tag. */
  appleTrueType: 0x74727565,
  woff: 0x774f4646, // 'wOFF'
  woff2: 0x774f4632, // 'wOF2'
  collection: 0x74746366, // 'ttcf'
} as const;

/** WOFF 1.0 header and table directory entry sizes (W3C WOFF 1.0, "WOFF Header", "Table Directory"). */
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const WOFF_LENGTH_OFFSET = 8;
const WOFF_NUM_TABLES_OFFSET = 12;
/** Bytes needed to read a signature. */
const SIGNATURE_BYTES = 4;

/** Printable ASCII, shown as is in messages; other bytes show as a dot. */
const FIRST_PRINTABLE = 0x20;
const LAST_PRINTABLE = 0x7e;

function printableStart(bytes: Uint8Array): string {
  return [...bytes.subarray(0, SIGNATURE_BYTES)].map((b) => (b >= FIRST_PRINTABLE && b <= LAST_PRINTABLE ? String.fromCharCode(b) : '·')).join('');
}

function truncated(fileName: string, detail: string): InputError {
  return new InputError('font-unreadable', fileName, `${fileName}: the font file is incomplete (${detail}). Download or export it again.`);
}

function checkSfntComplete(bytes: Uint8Array, fileName: string): void {
  let records;
  try {
    records = readTableRecords(bytes).records;
  } catch (error) {
    throw truncated(fileName, error instanceof Error ? error.message : String(error));
  }
  const outside = tablesOutsideFile(records, bytes.length);
  if (outside.length > 0) throw truncated(fileName, `table(s) ${outside.join(', ')} end past its ${bytes.length} bytes`);
}

function checkWoffComplete(bytes: Uint8Array, fileName: string): void {
  if (bytes.length < WOFF_HEADER_BYTES) throw truncated(fileName, 'shorter than a WOFF header');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const declared = view.getUint32(WOFF_LENGTH_OFFSET);
  if (declared !== bytes.length) throw truncated(fileName, `the header says ${declared} bytes, the file has ${bytes.length}`);
  const numTables = view.getUint16(WOFF_NUM_TABLES_OFFSET);
  if (WOFF_HEADER_BYTES + numTables * WOFF_ENTRY_BYTES > bytes.length) throw truncated(fileName, 'the table directory runs past the end');
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    if (view.getUint32(at + 4) + view.getUint32(at + 8) > bytes.length) throw truncated(fileName, 'a table ends past the end of the file');
  }
}

/**
 * The container of `bytes` (an OpenType/TrueType file or WOFF 1.0), checked to be
 * complete. Throws InputError 'font-unsupported' for WOFF2 and font collections and
 * 'font-unreadable' for anything that is not a font or is cut short.
 */
export function identifyFontContainer(bytes: Uint8Array, fileName: string): FontContainer {
  if (bytes.length < SIGNATURE_BYTES) {
    throw new InputError('font-unreadable', fileName, `${fileName}: not a font file (only ${bytes.length} bytes). Choose an .otf, .ttf or .woff file.`);
  }
  const signature = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength).getUint32(0);
  switch (signature) {
    case SIGNATURE.otto:
    case SIGNATURE.trueType:
    case SIGNATURE.appleTrueType:
      checkSfntComplete(bytes, fileName);
      return 'sfnt';
    case SIGNATURE.woff:
      checkWoffComplete(bytes, fileName);
      return 'woff';
    case SIGNATURE.woff2:
      throw new InputError('font-unsupported', fileName, `${fileName}: WOFF2 fonts are not supported. Convert it to .otf, .ttf or .woff (WOFF 1.0) first.`);
    case SIGNATURE.collection:
      throw new InputError('font-unsupported', fileName, `${fileName}: font collections (.ttc/.otc) are not supported. Extract the one font you need as .otf or .ttf first.`);
    default:
      throw new InputError('font-unreadable', fileName, `${fileName}: not a font file (it starts with "${printableStart(bytes)}"). Choose an .otf, .ttf or .woff file.`);
  }
}
