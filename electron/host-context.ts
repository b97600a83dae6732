// What a handler knows about the host it runs in: which host it is, and the project
// places the user has chosen there. Each host builds one per window (the Electron
// shell) or per run (the browser-mode host); tests build their own.
import type { HostKind } from './api-contract.ts';
import { ProjectHandles } from './places/project-handles.ts';
import type { ProjectPlaces } from './places/project-places.ts';

/** The project files a host may read and write, and what it remembers of them. */
export interface ProjectAccess {
  /** How the user names a project file (dialogs, or the browser workspace). */
  readonly places: ProjectPlaces;
  /** The places the user chose, by handle. */
  readonly handles: ProjectHandles;
  /** Host-owned folder for the autosaved copies of projects never saved. */
  readonly untitledFolder: string;
}

export interface HostContext {
  host: HostKind;
  projects: ProjectAccess;
  /**
   * Where the demo project's sheets are: absent, the ones shipped with Stemline
   * (electron/demo/sheets/); null, this host offers no demo and the window starts
   * on an empty project.
   */
  demoFolder?: string | null;
}

/** Project access with nothing chosen yet. */
export function projectAccess(places: ProjectPlaces, untitledFolder: string): ProjectAccess {
  return { places, handles: new ProjectHandles(), untitledFolder };
}
