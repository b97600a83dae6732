// The error a project file gives when it cannot be opened: not JSON, not a Stemline
// project, from a newer Stemline, or with a field that is wrong. The message names the
// file and, for a bad field, where it is ("glyphs[3].advanceWidth").

export type ProjectErrorKind = 'project-unreadable' | 'project-not-json' | 'project-not-stemline' | 'project-too-new' | 'project-invalid' | 'project-too-large';

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
