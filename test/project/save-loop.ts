// Child process for the crash-safety test: works on a large project as the app does,
// as fast as it can, until it is killed: each new version is autosaved, and every
// SAVE_EVERY-th one also saved. Prints "saving" once the loop has started, then
// "autosaved N" and "saved N" as each write completes, N counting from its second argument.
import { autosaveProject, saveProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';

const path = process.argv[2];
/** The first version to write, so versions keep rising from one run of the writer to the next. */
const first = Number(process.argv[3] ?? 1);
if (!path || !Number.isInteger(first)) throw new Error('usage: save-loop.ts PROJECT_PATH [FIRST_VERSION]');

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

/** One version in this many is saved; the others are only autosaved, as between the user's saves. */
const SAVE_EVERY = 3;

process.stdout.write('saving\n');
for (let n = first; ; n++) {
  await autosaveProject(path, version(n));
  process.stdout.write(`autosaved ${n}\n`);
  if (n % SAVE_EVERY === 0) {
    await saveProject(path, version(n));
    process.stdout.write(`saved ${n}\n`);
  }
}
