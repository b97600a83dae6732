// The command line's contract: --help and --version answer, usage errors exit 2
// with a message on stderr. Other tools script against these exit codes.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { runCaptured as run } from './run-captured.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };


describe('stemline command line', () => {
  it('prints its version as "stemline X.Y.Z" and exits 0', async () => {
    expect(await run(['--version'])).toEqual({ code: 0, out: `stemline ${pkg.version}\n`, err: '' });
  });

  it('prints usage on --help to stdout and exits 0', async () => {
    const result = await run(['--help']);
    expect(result.code).toBe(0);
    expect(result.out).toMatch(/^Usage: npm run --silent stemline -- <command>/m);
    expect(result.out).toMatch(/Exit status: 0 success, 1 bad input/);
  });

  it('exits 2 with usage on stderr when given nothing', async () => {
    const result = await run([]);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toMatch(/Usage:/);
  });

  it('exits 2 naming an unknown command', async () => {
    const result = await run(['frobnicate', 'x.png']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/unknown command or option "frobnicate"/);
  });

  it('works through "npm run --silent stemline" right after npm install', () => {
    const result = spawnSync('npm', ['run', '--silent', 'stemline', '--', '--version'], { cwd: root, encoding: 'utf8' });
    expect(result.status).toBe(0);
    expect(result.stdout).toBe(`stemline ${pkg.version}\n`);
    const usage = spawnSync('npm', ['run', '--silent', 'stemline', '--', '--nonsense'], { cwd: root, encoding: 'utf8' });
    expect(usage.status).toBe(2);
  });
});
