// Crash safety of saving: a process killed (SIGKILL, as by a crash or the system
// ending it) at random moments while autosaving and saving never leaves a damaged
// project: the file on disk always opens, complete, as the last version that
// finished saving or the one after it, and opening it offers the recovered work of
// at least the last version that finished autosaving.
import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { findRecovery, loadProject, saveProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { seededRandom } from '../support/seeded-random.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
/**
 * The writer runs as one plain node process with tsx's loader registered (`node
 * --import tsx`), not under the tsx command, whose wrapper process would take the
 * SIGKILL while the writer itself went on saving.
 */
const NODE_ARGS = ['--import', 'tsx'];
/** Kills per run: each one lands at a different moment of some save. */
const KILLS = 30;


/** The last versions the writer reported autosaved and saved before it was killed (0: none). */
interface Progress {
  autosaved: number;
  saved: number;
}

function runAndKill(path: string, firstVersion: number, delayMs: number): Promise<Progress> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [...NODE_ARGS, join(root, 'test', 'project', 'save-loop.ts'), path, String(firstVersion)], { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] });
    const progress: Progress = { autosaved: 0, saved: 0 };
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => {
      if (output === '') setTimeout(() => child.kill('SIGKILL'), delayMs);
      output += chunk.toString();
      for (const [, what, n] of output.matchAll(/^(autosaved|saved) (\d+)$/gm)) progress[what as keyof Progress] = Number(n);
    });
    child.once('error', reject);
    child.once('exit', (_code, signal) => (signal === 'SIGKILL' ? resolve(progress) : reject(new Error(`the writer ended by itself (${String(signal)})`))));
  });
}

/** The version number in a project's family name ("Version 12"). */
const versionOf = (project: { font: { familyName: string } }) => Number(/^Version (\d+)$/.exec(project.font.familyName)?.[1] ?? Number.NaN);

describe('saving under SIGKILL', () => {
  it(`leaves an intact, loadable project after ${KILLS} kills at random moments`, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'stemline-crash-'));
    const path = join(folder, 'lettering.stemline');
    await saveProject(path, newProject('Version 0'));
    const random = seededRandom(20261201);
    const seen = new Set<string>();
    let next = 1;
    for (let kill = 0; kill < KILLS; kill++) {
      const { autosaved, saved } = await runAndKill(path, next, Math.floor(random() * 400));
      const size = statSync(path).size;
      await new Promise((r) => setTimeout(r, 50));
      expect(statSync(path).size).toBe(size); // nothing goes on writing after the kill
      const project = await loadProject(path); // throws if the file were torn
      const onDisk = versionOf(project);
      expect(project.glyphs.length === 0 || project.glyphs.length === 400).toBe(true);
      // The saved file is the last save that finished, or the one under way when the kill came (its rename done, its report not yet written).
      expect(onDisk === 0 || onDisk >= saved, `kill ${kill}: saved ${saved}, on disk ${onDisk}`).toBe(true);
      // Opening offers the recovered work when it is newer; what the user is offered is never older than the last finished autosave.
      const recovery = await findRecovery(path);
      const offered = recovery === null ? onDisk : versionOf(recovery.project);
      expect(offered, `kill ${kill}: autosaved ${autosaved}, saved ${saved}, on disk ${onDisk}, recovery ${recovery === null ? 'none' : offered}`).toBeGreaterThanOrEqual(autosaved);
      seen.add(project.font.familyName);
      next = Math.max(next, autosaved, saved, onDisk, offered) + 1;
    }
    expect(seen.size).toBeGreaterThan(1); // the kills really did land during different saves
    // Temporary files a killed save leaves behind are hidden beside the project, never in its place.
    for (const leftover of readdirSync(folder).filter((f) => f !== 'lettering.stemline')) expect(leftover).toMatch(/^\.lettering\.stemline\.(.*\.tmp|recovery)$|^\.\.lettering\.stemline\.recovery\..*\.tmp$/);
  }, 300_000);
});
