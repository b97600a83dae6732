// Child process for the crash-safety test: saves ever-newer versions of a large
// project to the path it is given, as fast as it can, until it is killed. Prints
// "saving" once the loop has started.
import { saveProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';

const path = process.argv[2];
if (!path) throw new Error('usage: save-loop.ts PROJECT_PATH');

/** Glyphs per saved version: about 1 MB of JSON, so a save takes long enough to be interrupted. */
const GLYPHS_PER_VERSION = 400;

function version(n: number): ProjectData {
  const glyph = (i: number): ProjectData['glyphs'][number] => ({
    unicodes: [(0x4e00 + i).toString(16).toUpperCase()],
    advanceWidth: 1000,
    outline: { contours: [Array.from({ length: 24 }, (_, k) => [100 + k * 30, (n + i + k) % 700, k % 3 === 0 ? 'on' : k % 3 === 1 ? 'off' : 'off'] as [number, number, 'on' | 'off'])] },
  });
  return { ...newProject(`Version ${n}`), glyphs: Array.from({ length: GLYPHS_PER_VERSION }, (_, i) => glyph(i)) };
}

process.stdout.write('saving\n');
for (let n = 1; ; n++) await saveProject(path, version(n));
