// Help ▸ user guide: the file it opens is the user guide's contents page, in a
// development run (the project folder) and in an installed app, where it lies in the
// folder electron-builder unpacks beside the app's archive (electron-builder's
// asarUnpack: "app.asar.unpacked" beside "app.asar"), on Linux, macOS and Windows paths.
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { userGuidePath } from '../../electron/shell/user-guide.ts';
import { PROJECT_ROOT } from '../../electron/project-paths.ts';

describe('the user guide Help opens', () => {
  it('is the guide’s contents page, not the README, in a development run', () => {
    const guide = userGuidePath(PROJECT_ROOT);
    expect(guide).toBe(path.join(PROJECT_ROOT, 'docs', 'guide', 'README.md'));
    expect(readFileSync(guide, 'utf8').split('\n')[0]).toBe('# Stemline user guide');
  });

  it('lies in the unpacked folder beside an installed app’s archive, where the system’s viewer can read it', () => {
    expect(userGuidePath('/opt/Stemline/resources/app.asar', path.posix)).toBe('/opt/Stemline/resources/app.asar.unpacked/docs/guide/README.md');
    expect(userGuidePath('/Applications/Stemline.app/Contents/Resources/app.asar', path.posix)).toBe('/Applications/Stemline.app/Contents/Resources/app.asar.unpacked/docs/guide/README.md');
    expect(userGuidePath('C:\\Program Files\\Stemline\\resources\\app.asar', path.win32)).toBe('C:\\Program Files\\Stemline\\resources\\app.asar.unpacked\\docs\\guide\\README.md');
    // An unpacked app folder (electron-builder with asar off) is used as it is.
    expect(userGuidePath('/opt/Stemline/resources/app', path.posix)).toBe('/opt/Stemline/resources/app/docs/guide/README.md');
  });

  it('links only to chapters of its own folder, so the packed copy has no broken links', () => {
    const folder = path.join(PROJECT_ROOT, 'docs', 'guide');
    for (const chapter of readdirSync(folder).filter((name) => name.endsWith('.md'))) {
      const text = readFileSync(path.join(folder, chapter), 'utf8');
      for (const [, target] of text.matchAll(/\]\(([^)#\s]+)(?:#[^)]*)?\)/g)) {
        if (/^[a-z]+:/.test(target!)) continue; // an address on the web
        const resolved = path.resolve(folder, target!);
        expect(existsSync(resolved), `${chapter} → ${target}`).toBe(true);
        // electron-builder.yml packs docs/guide/** and docs/images/** and nothing else of docs/.
        expect(['guide', 'images'].some((packed) => resolved.startsWith(path.join(PROJECT_ROOT, 'docs', packed) + path.sep)), `${chapter} → ${target}`).toBe(true);
      }
    }
  });
});
