// Turns a failure to read or write a project, or to write an exported font, into the
// message the renderer shows: what went wrong, in words (a full disk, no permission),
// and what to do. A project file's own problems (ProjectError) already say so and pass through unchanged.
import { HandlerError } from './handler-error.ts';
import { ProjectError } from './io/project/project-error.ts';

/** What the user was doing, for the message: "save", "open", "autosave". */
export type FileAction = 'save' | 'open' | 'autosave' | 'read the recovered work of' | 'discard the recovered work of' | 'export the font to';

const REASONS: Record<string, string> = {
  ENOSPC: 'the disk is full',
  EDQUOT: 'your disk quota is used up',
  EACCES: 'Stemline is not allowed to use that file or folder (permission denied)',
  EPERM: 'Stemline is not allowed to use that file or folder (operation not permitted)',
  EROFS: 'the disk is read-only',
  ENOENT: 'its folder no longer exists',
  EISDIR: 'that name is a folder',
  EBUSY: 'the file is in use by another program',
};

/** The HandlerError for `error`, raised while doing `action` to the project `name`. */
export function fileFailure(error: unknown, action: FileAction, name: string): HandlerError {
  if (error instanceof HandlerError) return error;
  if (error instanceof ProjectError) return new HandlerError('project-file', error.message);
  const code = (error as NodeJS.ErrnoException | undefined)?.code;
  const reason = (code !== undefined ? REASONS[code] : undefined) ?? `the system reported ${code ?? (error instanceof Error ? error.message : String(error))}`;
  const advice = action === 'open' || action === 'read the recovered work of'
    ? 'Check the file and try again.'
    : action === 'export the font to'
      ? 'Nothing was written: fix that and export again, or choose another place.'
      : 'Your work is still open in the window: fix that and save again, or choose another place with Save as….';
  return new HandlerError('project-file', `Could not ${action} ${name}: ${reason}. ${advice}`);
}
