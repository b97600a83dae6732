// The error a project file gives when it cannot be opened: not JSON, not a Stemline
// project, from a newer Stemline, or with a field that is wrong; and when one of its
// scans cannot be had: the file is gone and there is no embedded copy, or the copy
// does not match its SHA-256. The message names the file and, for a bad field,
// where it is ("glyphs.3.advanceWidth").

export type ProjectErrorKind =
  | 'project-unreadable'
  | 'project-not-json'
  | 'project-not-stemline'
  | 'project-too-new'
  | 'project-invalid'
  | 'project-too-large'
  | 'scan-missing'
  | 'scan-damaged';

export class ProjectError extends Error {
  readonly kind: ProjectErrorKind;
  readonly file: string;
  constructor(kind: ProjectErrorKind, file: string, message: string) {
    super(message);
    this.name = 'ProjectError';
    this.kind = kind;
    this.file = file;
  }
}

/** The error for a field of the project `file` that is wrong: `where` is its dotted path ("glyphs.3.unicodes"). */
export function invalidFieldError(file: string, where: string, problem: string): ProjectError {
  return new ProjectError('project-invalid', file, `${file}: ${where} is wrong: ${problem}. Fix that field or open the recovery copy.`);
}
