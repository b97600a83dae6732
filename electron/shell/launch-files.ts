// The project files the system asks the app to open: on Linux and Windows as command
// line arguments (double-clicking a .stemline file starts `stemline FILE`, and a
// second start hands its arguments to the running app), on macOS through the
// open-file event. Only arguments naming a project file are taken; everything else on
// the command line (Electron's own flags, the app's folder in development) is ignored.
import { isAbsolute, resolve } from 'node:path';
import { hasProjectExtension } from '../places/workspace-files.ts';
import { isRecentPath } from '../places/recent-projects.ts';

/** The project files named in `argv`, as absolute paths resolved against `workingDirectory`, each once. */
export function projectFilesIn(argv: readonly string[], workingDirectory: string): string[] {
  const files: string[] = [];
  for (const argument of argv) {
    if (argument.startsWith('-') || !hasProjectExtension(argument)) continue;
    const path = isAbsolute(argument) ? resolve(argument) : resolve(workingDirectory, argument);
    if (isRecentPath(path) && !files.includes(path)) files.push(path);
  }
  return files;
}
