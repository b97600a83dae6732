// Crash safety of saving: a process killed (SIGKILL, as by a power cut or a crash)
// at random moments while saving never leaves a damaged project: the file on disk
// always opens, complete, as the last version that finished saving or one before it.
import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadProject, saveProject } from '../../electron/io/project/project-file.ts';
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
const KILLS = 12;


function runAndKill(path: string, delayMs: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [...NODE_ARGS, join(root, 'test', 'project', 'save-loop.ts'), path], { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] });
    child.stdout.once('data', () => setTimeout(() => child.kill('SIGKILL'), delayMs));
    child.once('error', reject);
    child.once('exit', (_code, signal) => (signal === 'SIGKILL' ? resolve() : reject(new Error(`the writer ended by itself (${String(signal)})`))));
  });
}

describe('saving under SIGKILL', () => {
  it(`leaves an intact, loadable project after ${KILLS} kills at random moments`, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'stemline-crash-'));
    const path = join(folder, 'lettering.stemline');
    await saveProject(path, newProject('Version 0'));
    const random = seededRandom(20261201);
    const seen = new Set<string>();
    for (let kill = 0; kill < KILLS; kill++) {
      await runAndKill(path, Math.floor(random() * 250));
      const size = statSync(path).size;
      await new Promise((r) => setTimeout(r, 50));
      expect(statSync(path).size).toBe(size); // nothing goes on writing after the kill
      const project = await loadProject(path); // throws if the file were torn
      expect(project.font.familyName).toMatch(/^Version \d+$/);
      expect(project.glyphs.length === 0 || project.glyphs.length === 400).toBe(true);
      seen.add(project.font.familyName);
    }
    expect(seen.size).toBeGreaterThan(1); // the kills really did land during different saves
    // Temporary files a killed save leaves behind are hidden beside the project, never in its place.
    for (const leftover of readdirSync(folder).filter((f) => f !== 'lettering.stemline')) expect(leftover).toMatch(/^\.lettering\.stemline\..*\.tmp$/);
  }, 120_000);
});
