// What the host remembers of the project places the user chose: each file they
// opened or saved through a dialog or the workspace listing, and each recovery place
// of a project never saved, under an opaque handle the renderer sends back. A handle
// the host never gave (or forgot when it restarted) is refused, so the renderer can
// only ever reach the places the user answered.
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { HandlerError } from '../handler-error.ts';
import type { ProjectHandle } from '../api-contract.ts';
import { PROJECT_EXTENSION } from '../io/project/project-schema.ts';

/** Random bytes per handle: 128 bits, so a handle cannot be guessed. */
const HANDLE_BYTES = 16;

/** How a handle is spelled: lowercase hex of HANDLE_BYTES bytes. */
export const HANDLE_PATTERN = /^[0-9a-f]{32}$/;

/** File-name prefix of a never-saved project's place in the host's recovery folder. */
export const UNTITLED_PREFIX = 'untitled-';

/**
 * A project's place. For a file, `path` is the project file. For a project never
 * saved, `path` is a project path in the host's recovery folder that never holds a
 * file; its recovery copy sits beside it as for any project (project-file.ts).
 */
export type ProjectPlace = { kind: 'file'; path: string } | { kind: 'untitled'; path: string };

export class ProjectHandles {
  private readonly places = new Map<ProjectHandle, ProjectPlace>();

  /** The handle of `place`, the same one each time the same place is remembered. */
  remember(place: ProjectPlace): ProjectHandle {
    for (const [handle, known] of this.places) {
      if (known.kind === place.kind && known.path === place.path) return handle;
    }
    const handle = randomBytes(HANDLE_BYTES).toString('hex');
    this.places.set(handle, place);
    return handle;
  }

  /** A new place, in `recoveryFolder`, for the autosaved copy of a project never saved. */
  newUntitled(recoveryFolder: string): ProjectHandle {
    const id = randomBytes(HANDLE_BYTES).toString('hex');
    return this.remember({ kind: 'untitled', path: join(recoveryFolder, `${UNTITLED_PREFIX}${id}${PROJECT_EXTENSION}`) });
  }

  /** The place `handle` names; throws HandlerError 'project-unknown' when the host gave no such handle. */
  place(handle: ProjectHandle): ProjectPlace {
    const place = this.find(handle);
    if (place === undefined) {
      throw new HandlerError('project-unknown', 'Stemline no longer knows where this project is kept (its host was restarted since the project was opened). Use Save as… to choose where to save it; your work is still in the window.');
    }
    return place;
  }

  /** The place `handle` names, or undefined. */
  find(handle: ProjectHandle): ProjectPlace | undefined {
    return this.places.get(handle);
  }
}
