// The installers' configuration, electron-builder.yml, loaded as electron-builder
// loads it (YAML through js-yaml) and checked against electron-builder's own schema
// (app-builder-lib's scheme.json, shipped with electron-builder), so a misspelt key or
// a wrong type fails here rather than on the packaging machine. Then the desktop
// issue's list: Linux AppImage and deb, macOS dmg, Windows nsis; the app id; icons of
// our own, at the sizes the targets need, equal to what electron/resources/draw-icon.ts
// draws; the project file's association; the Electron version; the fuses the Electron
// security checklist asks to flip.
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import sharp from 'sharp';
import { load } from 'js-yaml';
import { APP_NAME } from '../../electron/app-identity.ts';
import { PROJECT_EXTENSION } from '../../electron/io/project/project-schema.ts';
import { iconSvg } from '../../electron/resources/draw-icon.ts';
import { PROJECT_ROOT } from '../../electron/project-paths.ts';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

interface Schema {
  $ref?: string;
  anyOf?: Schema[];
  type?: string | string[];
  properties?: Record<string, Schema>;
  additionalProperties?: boolean | Schema;
  items?: Schema | Schema[];
  enum?: Json[];
  required?: string[];
  definitions?: Record<string, Schema>;
}

const config = load(readFileSync(join(PROJECT_ROOT, 'electron-builder.yml'), 'utf8')) as Record<string, Json> & {
  linux: Record<string, Json>;
  mac: Record<string, Json>;
  win: Record<string, Json>;
  nsis: Record<string, Json>;
  directories: Record<string, string>;
  fileAssociations: Record<string, Json>[];
  electronFuses: Record<string, boolean>;
  files: string[];
  asarUnpack: string[];
};
const pkg = JSON.parse(readFileSync(join(PROJECT_ROOT, 'package.json'), 'utf8')) as { main: string; optionalDependencies: Record<string, string> };

/** electron-builder's configuration schema, as the electron-builder package installed here ships it. */
function builderSchema(): Schema {
  const fromBuilder = createRequire(createRequire(import.meta.url).resolve('electron-builder/package.json'));
  return JSON.parse(readFileSync(fromBuilder.resolve('app-builder-lib/scheme.json'), 'utf8')) as Schema;
}

function typeOf(value: Json): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number';
  return typeof value;
}

/**
 * The ways `value` breaks `schema` (the parts of JSON Schema draft 7 scheme.json uses:
 * $ref, anyOf, type, properties, additionalProperties, items, enum, required), each
 * with its path; empty when it conforms.
 */
function problems(value: Json, schema: Schema, root: Schema, path: string): string[] {
  if (schema.$ref !== undefined) {
    const name = schema.$ref.replace('#/definitions/', '');
    const target = root.definitions?.[name];
    return target === undefined ? [`${path}: unknown schema ${schema.$ref}`] : problems(value, target, root, path);
  }
  if (schema.anyOf !== undefined) {
    const each = schema.anyOf.map((branch) => problems(value, branch, root, path));
    return each.some((p) => p.length === 0) ? [] : [`${path}: matches none of its forms (${each.map((p) => p[0]).join(' | ')})`];
  }
  if (schema.type !== undefined) {
    const types = Array.isArray(schema.type) ? schema.type : [schema.type];
    const actual = typeOf(value);
    if (!types.includes(actual) && !(actual === 'integer' && types.includes('number'))) return [`${path}: is ${actual}, not ${types.join(' or ')}`];
  }
  if (schema.enum !== undefined && !schema.enum.includes(value)) return [`${path}: ${JSON.stringify(value)} is not one of ${JSON.stringify(schema.enum)}`];
  const found: string[] = [];
  if (Array.isArray(value) && schema.items !== undefined && !Array.isArray(schema.items)) {
    value.forEach((item, i) => found.push(...problems(item, schema.items as Schema, root, `${path}[${i}]`)));
  }
  if (typeOf(value) === 'object' && (schema.properties !== undefined || schema.additionalProperties !== undefined)) {
    const object = value as Record<string, Json>;
    for (const key of schema.required ?? []) if (!(key in object)) found.push(`${path}.${key}: is required`);
    for (const [key, item] of Object.entries(object)) {
      const property = schema.properties?.[key];
      if (property !== undefined) found.push(...problems(item, property, root, `${path}.${key}`));
      else if (schema.additionalProperties === false) found.push(`${path}.${key}: is not an electron-builder option`);
    }
  }
  return found;
}

async function pixels(png: Buffer | string) {
  const { data, info } = await sharp(png).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

describe('electron-builder.yml', () => {
  it('is valid against electron-builder’s own configuration schema', () => {
    const schema = builderSchema();
    expect(problems(config as Json, schema, schema, 'config')).toEqual([]);
  });

  it('the schema check itself catches a misspelt key and a wrong type', () => {
    const schema = builderSchema();
    expect(problems({ ...config, fileAssociation: [] } as Json, schema, schema, 'config')).toEqual(['config.fileAssociation: is not an electron-builder option']);
    expect(problems({ ...config, linux: { ...config.linux, category: 7 } } as Json, schema, schema, 'config')[0]).toMatch(/^config\.linux/);
  });

  it('builds AppImage and deb on Linux, a dmg on macOS and an nsis installer on Windows', () => {
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.mac.target).toEqual(['dmg']);
    expect(config.win.target).toEqual(['nsis']);
  });

  it('names the app with a reverse-DNS id of its own and the product name the app reports', () => {
    expect(config.appId).toMatch(/^[a-z][a-z0-9-]*(\.[a-z][a-z0-9-]*){2,}$/);
    expect(config.appId).toContain('stemline');
    expect(config.productName).toBe(APP_NAME);
  });

  it('packs the Electron version package.json installs (checklist item 16: use a current version, the one tested)', () => {
    expect(config.electronVersion).toBe(pkg.optionalDependencies.electron);
  });

  it('packs the built shell, renderer and user guide, and the entry point package.json names is among them', () => {
    expect(config.files).toEqual(expect.arrayContaining(['build/electron/**', 'build/renderer/**', 'package.json', 'docs/guide/**', 'docs/images/**']));
    expect(pkg.main.startsWith('build/electron/')).toBe(true);
    expect(config.asarUnpack).toEqual(expect.arrayContaining(['node_modules/sharp/**']));
    // Help ▸ user guide hands the guide to the system's viewer, which cannot read into the archive (electron/shell/user-guide.ts).
    expect(config.asarUnpack).toEqual(expect.arrayContaining(['docs/guide/**', 'docs/images/**']));
  });

  it('associates the project file, so double-clicking one opens Stemline', () => {
    const association = config.fileAssociations.find((a) => a.ext === PROJECT_EXTENSION.slice(1));
    expect(association).toMatchObject({ name: 'Stemline project', role: 'Editor', mimeType: expect.stringMatching(/^application\/x-/) });
    // electron-builder (FileAssociation): on Windows the association is written only by a per-machine install.
    expect(config.nsis.perMachine).toBe(true);
  });

  it('flips the fuses the Electron security checklist asks for (item 19, “Check which fuses you can change”)', () => {
    // https://www.electronjs.org/docs/latest/tutorial/fuses : what each fuse does and its safe setting.
    expect(config.electronFuses).toEqual({
      runAsNode: false,
      enableCookieEncryption: true,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
      grantFileProtocolExtraPrivileges: false,
    });
  });

  it('uses icons that exist, at the sizes the targets need', async () => {
    const resources = join(PROJECT_ROOT, config.directories.buildResources ?? 'build');
    for (const icon of [config.mac.icon, config.win.icon] as string[]) {
      // macOS wants a 1024 px master (Apple HIG, app icons); electron-builder makes the .icns and the .ico from it.
      const meta = await sharp(join(PROJECT_ROOT, icon)).metadata();
      expect([meta.format, meta.width, meta.height]).toEqual(['png', 1024, 1024]);
    }
    const linuxIcons = readdirSync(join(PROJECT_ROOT, config.linux.icon as string)).sort();
    for (const size of [16, 32, 48, 256, 512]) expect(linuxIcons).toContain(`${size}x${size}.png`);
    expect(existsSync(join(resources, 'icon.png'))).toBe(true);
  });

  it('uses the icon our own drawing script makes, pixel for pixel (nothing copied in)', async () => {
    const committed = await pixels(join(PROJECT_ROOT, 'electron', 'resources', 'icon.png'));
    const drawn = await pixels(Buffer.from(iconSvg()));
    expect([committed.width, committed.height]).toEqual([drawn.width, drawn.height]);
    expect(committed.data.equals(drawn.data)).toBe(true);
  });
});
