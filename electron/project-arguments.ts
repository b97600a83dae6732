// The argument checks of the project intents (valibot): handles as the host spells
// them, file names no longer than a file system takes, and projects that are valid
// project files of at most the size a project may have, whose embedded scans match
// their digests. A refused argument is a HandlerError naming the field.
import * as v from 'valibot';
import { HandlerError } from './handler-error.ts';
import { HANDLE_PATTERN } from './places/project-handles.ts';
import { MAX_FILE_NAME_LENGTH } from './places/workspace-files.ts';
import { projectSchema, type ProjectData } from './io/project/project-schema.ts';
import { MAX_PROJECT_BYTES } from './io/project/project-file.ts';
import { embeddedScanBytes } from './io/project/embedded-scan.ts';
import type { HostIntents, IntentName } from './api-contract.ts';
import { exceedsJsonSize } from './json-size.ts';
import { schemaProblem } from './io/project/schema-issue.ts';

const handleSchema = v.pipe(v.string(), v.regex(HANDLE_PATTERN, 'a project handle the host gave'));
const nameSchema = v.pipe(v.string(), v.minLength(1, 'a file name'), v.maxLength(MAX_FILE_NAME_LENGTH, `a file name of at most ${MAX_FILE_NAME_LENGTH} characters`));
/** The project is checked separately (checkedProject): first its size, then its schema. */
const projectPlaceholder = v.unknown();

const SCHEMAS = {
  openProject: v.strictObject({ name: v.optional(nameSchema) }),
  saveProject: v.strictObject({ handle: handleSchema, project: projectPlaceholder }),
  saveProjectAs: v.strictObject({ project: projectPlaceholder, name: v.optional(nameSchema), replacing: v.optional(handleSchema) }),
  autosaveProject: v.strictObject({ handle: v.optional(handleSchema), project: projectPlaceholder }),
  findRecoveredWork: v.strictObject({ handle: v.optional(handleSchema) }),
  discardRecoveredWork: v.strictObject({ handle: handleSchema }),
  openRecentProject: v.strictObject({ handle: handleSchema }),
};

type ProjectIntent = keyof typeof SCHEMAS;

function refused(intent: IntentName, where: string, problem: string): HandlerError {
  return new HandlerError('bad-arguments', `The request "${intent}" was refused: ${where} is wrong (${problem}). This is a bug in the app: please report it.`);
}

/**
 * `raw` as a project to write: at most MAX_PROJECT_BYTES of JSON (the most a project
 * file may hold, so it can be opened again), valid against the project schema, and
 * every embedded scan matching its SHA-256.
 */
function checkedProject(intent: IntentName, raw: unknown): ProjectData {
  if (exceedsJsonSize(raw, MAX_PROJECT_BYTES)) {
    throw new HandlerError('bad-arguments', `The project is larger than the ${MAX_PROJECT_BYTES / 2 ** 20} MiB a Stemline project may hold, so it was not written. Use smaller scans (a lower resolution or a cropped sheet).`);
  }
  const result = v.safeParse(projectSchema, raw);
  if (!result.success) {
    const { where: path, problem } = schemaProblem(result.issues, 'this request does not take it');
    const where = path ? `project.${path}` : 'the project';
    throw new HandlerError('bad-arguments', `The project could not be written: ${where} is wrong (${problem}). Undo the last edit and try again; if it persists, please report it.`);
  }
  result.output.scans.forEach((scan, index) => {
    if (scan.embedded !== undefined && embeddedScanBytes(scan.embedded) === undefined) {
      throw refused(intent, `project.scans.${index}.embedded`, 'the copy of the scan does not match its SHA-256');
    }
  });
  return result.output;
}

/** The validated arguments of a project intent; throws HandlerError 'bad-arguments'. */
export function projectArguments<K extends ProjectIntent>(intent: K, raw: unknown): HostIntents[K]['args'] {
  const result = v.safeParse(SCHEMAS[intent], raw ?? {});
  if (!result.success) {
    const { where, problem } = schemaProblem(result.issues, 'this request does not take it');
    throw refused(intent, where ?? 'the arguments', problem);
  }
  const args = result.output as Record<string, unknown>;
  if ('project' in args) args.project = checkedProject(intent, args.project);
  return args as HostIntents[K]['args'];
}
