// Every kind of error Stemline shows a user, in one place, with what to do about
// each. The errors themselves stay where they are thrown (InputError for files
// read, ProjectError for project files, FontError for building a font, RasterError
// and OutlineError from core/, HandlerError at the host's boundary); their kinds are
// typed unions, so a new kind does not compile until it has its remedy here. The CLI
// reports every one of these as bad input (exit 1); only CliUsageError is a usage
// error (exit 2). The README's Troubleshooting section is drawn from this list.
import { InputError, type InputErrorKind } from './io/input-error.ts';
import { ProjectError, type ProjectErrorKind } from './io/project/project-error.ts';
import { FontError, type FontErrorKind } from './io/font/font-error.ts';
import { HandlerError, type HandlerErrorKind } from './handler-error.ts';
import { RasterError, type RasterErrorCode } from '../core/raster/index.ts';
import { OutlineError, type OutlineErrorCode } from '../core/outline/index.ts';
import { DraftFontError } from '../core/pipeline/index.ts';

/** What to do, per kind: the last sentence of the kind's messages, in general form. */
export interface ErrorCatalogue {
  readonly input: Readonly<Record<InputErrorKind, string>>;
  readonly project: Readonly<Record<ProjectErrorKind, string>>;
  readonly font: Readonly<Record<FontErrorKind, string>>;
  readonly raster: Readonly<Record<RasterErrorCode, string>>;
  readonly outline: Readonly<Record<OutlineErrorCode, string>>;
  readonly handler: Readonly<Record<HandlerErrorKind, string>>;
}

export const ERROR_REMEDIES: ErrorCatalogue = {
  input: {
    'file-unreadable': 'Check the file name and that you may read the file; choose a file, not a folder.',
    'image-unsupported': 'Save the scan as PNG, JPEG, TIFF or WebP.',
    'image-corrupt': 'Export or scan the image again; a file still downloading or syncing is incomplete.',
    'image-too-large': 'Scan at a lower resolution (the message says which fits) or crop the sheet.',
    'image-empty': 'Check the scan has ink on it, or set a threshold by hand (--threshold) or --invert for light ink on dark paper.',
    'font-unreadable': 'Export or download the font again, or try another copy.',
    'font-unsupported': 'Convert the font to .otf, .ttf or WOFF 1.0, one font per file.',
    'font-too-large': 'Choose another copy of the font; this one is damaged or is not a font to open here.',
  },
  project: {
    'project-unreadable': 'Check the file name and that you may read the file.',
    'project-not-json': 'Wait for a syncing cloud drive to finish, or open the project\'s recovery copy.',
    'project-not-stemline': 'Open a .stemline project; to start from a font, use "stemline import".',
    'project-too-new': 'Update Stemline to open it; the file is left unchanged.',
    'project-invalid': 'Fix the field the message names, or open the project\'s recovery copy.',
    'project-too-large': 'Open a .stemline project; a file this large is not one.',
    'scan-missing': 'Put the scan back beside the project, or save with the scans embedded.',
    'scan-damaged': 'Put the original scan back beside the project; its embedded copy is damaged.',
  },
  font: {
    'bad-metrics': 'Type font heights that make sense (units per em 16–16384, descender at or below the baseline, ascender above the x-height).',
    'bad-name': 'Give the font a family and style name of at most 200 characters.',
    'bad-character': 'Give the glyph one character, or none and a glyph name.',
    'duplicate-character': 'Give the character to one glyph only.',
    'bad-glyph-name': 'Rename the glyph with letters, digits, "_" and "." only.',
    'duplicate-glyph-name': 'Rename one of the two glyphs.',
    'bad-advance-width': 'Set the glyph\'s advance to a whole number of units from 0 to 32767.',
    'coordinate-out-of-range': 'Move or scale the glyph\'s points to within ±32767 units.',
    'bad-outline': 'Redraw or refit the contour the message names.',
  },
  raster: {
    'bad-raster': 'Export or scan the image again; the decoded pixels are not a whole image.',
    'bad-option': 'Give the option a value in the range the message states.',
    'empty-page': 'Check the scan has ink on it, or set the threshold by hand or invert light ink on dark paper.',
  },
  outline: {
    'bad-contour': 'Redraw the contour the message names.',
    'bad-outline-data': 'Fix the glyph the message names in the project, or open its recovery copy.',
  },
  handler: {
    'unknown-intent': 'Report it: the app asked its host for something it does not offer.',
    'bad-arguments': 'Undo the last edit and try again; if it persists, report it.',
    'path-refused': 'Choose the file in the dialog or from the workspace listing.',
    'project-unknown': 'Open the project again: the host has restarted since it was opened.',
    'project-file': 'Fix what the message names (a full disk, a permission), then save again or choose another place.',
    'font-build': 'Change the glyph or value the message names, then build again.',
    'demo-missing': 'Draw the demo sheets again with "npx tsx electron/demo/generate-demo-sheets.ts".',
    'scan-unreadable': 'Save the scan compressed (Group 4 for 1-bit, LZW or Deflate for grey), scan at a lower resolution, or crop the sheet.',
  },
};

/** Whether `error` is one of the errors above, or the pipeline's: bad input to report in one line (CLI exit 1), not a crash. */
export function isUserFacingError(error: unknown): error is Error {
  return [InputError, ProjectError, FontError, RasterError, OutlineError, HandlerError, DraftFontError].some((type) => error instanceof type);
}

/** The remedy for `error`'s kind, or undefined for an error not in the catalogue. */
export function remedyFor(error: unknown): string | undefined {
  if (error instanceof InputError) return ERROR_REMEDIES.input[error.kind];
  if (error instanceof ProjectError) return ERROR_REMEDIES.project[error.kind];
  if (error instanceof FontError) return ERROR_REMEDIES.font[error.kind];
  if (error instanceof RasterError) return ERROR_REMEDIES.raster[error.code];
  if (error instanceof OutlineError) return ERROR_REMEDIES.outline[error.code];
  if (error instanceof HandlerError) return ERROR_REMEDIES.handler[error.kind];
  return undefined;
}
