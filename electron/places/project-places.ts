// How the user names a project file (or the file a font is exported to) in this host. The desktop app asks through the
// operating system's file dialogs; browser mode, which has no native dialog, lets the
// page choose a file name from its workspace folder. Either way the renderer never
// hands the host a path: it gets only the paths a dialog answered or that lie in the
// workspace (the rule of the desktop shell's issue: paths come from a dialog the user
// answered or from the project's own folder).
import type { ProjectListing } from '../api-contract.ts';

export interface ProjectPlaces {
  /** The project files to list in the page (browser mode), or that the host uses dialogs. */
  list(): Promise<ProjectListing>;
  /**
   * The absolute path of the project file the user chose to open, or null when they
   * cancelled. `name` is the page's choice (browser mode only). Throws HandlerError
   * 'path-refused' for a name the host does not take.
   */
  chooseToOpen(name: string | undefined): Promise<string | null>;
  /**
   * The absolute path the user chose to save to (ending in the project extension), or
   * null when they cancelled. `suggestedName` is offered in a dialog.
   */
  chooseToSave(name: string | undefined, suggestedName: string): Promise<string | null>;
  /**
   * The absolute path the user chose to export the font to (ending in ".otf"), or
   * null when they cancelled; the same rules as saving a project. `suggestedName` is
   * offered in a dialog.
   */
  chooseToExportFont(name: string | undefined, suggestedName: string): Promise<string | null>;
  /**
   * Whether the project file at `path` (one the user chose earlier: the recent list)
   * may be opened again in this host: any such file in the desktop app, only one
   * directly inside the workspace in browser mode.
   */
  mayReopen(path: string): Promise<boolean>;
  /**
   * The absolute path of the scan the user chose to import (File ▸ Import scans… in the
   * desktop app), or null when they cancelled. Browser mode has no such dialog: the page
   * takes scans itself, and this throws HandlerError 'path-refused'.
   */
  chooseScanToImport(): Promise<string | null>;
}
