/**
 * The project file format's versions and the steps between them. Pure: takes parsed JSON, returns a
 * new value (the input is never changed); anything it does not recognise is passed on untouched for
 * validation to report in the user's words.
 *
 * Version 2 (this build): element kinds spelled with a dash like the others (`dc-bus`, `dc-dc`
 * beside `dc-load`); the NEC raceway `aluminium` (one spelling of the metal in the whole format, as
 * the conductor `material` already had it); the pump study `pumpDuty` (was `flowStudy`, a name it
 * shared with the energy-flow diagram).
 * Version 1: the first published format.
 */

/** The project format version this build writes. */
export const PROJECT_VERSION = 2;

/** The oldest version this build still reads (brought up to date by `migrateProject`). */
export const OLDEST_PROJECT_VERSION = 1;

const KIND_RENAMES_1_TO_2: Readonly<Record<string, string>> = { dcbus: 'dc-bus', dcdc: 'dc-dc' };
const RACEWAY_RENAMES_1_TO_2: Readonly<Record<string, string>> = { aluminum: 'aluminium' };

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const own = (o: Json, key: string): boolean => Object.prototype.hasOwnProperty.call(o, key);

/** Version 1 → 2 on one element (a new object where anything changes). */
function element1to2(e: unknown): unknown {
  if (!isObject(e)) return e;
  let out = e;
  const kind = e['kind'];
  if (typeof kind === 'string' && own(KIND_RENAMES_1_TO_2, kind)) out = { ...out, kind: KIND_RENAMES_1_TO_2[kind] };
  const conductor = e['conductor'];
  if (isObject(conductor)) {
    const raceway = conductor['raceway'];
    if (typeof raceway === 'string' && own(RACEWAY_RENAMES_1_TO_2, raceway)) out = { ...out, conductor: { ...conductor, raceway: RACEWAY_RENAMES_1_TO_2[raceway] } };
  }
  return out;
}

function project1to2(p: Json): Json {
  const out: Json = {};
  // Key order kept (a stored file read and written back differs only where the format changed).
  for (const key of Object.keys(p)) {
    if (key === 'flowStudy') {
      if (!own(p, 'pumpDuty')) out['pumpDuty'] = p[key];
      else out[key] = p[key]; // both present: left for validation to name the unknown field
    } else if (key === 'elements') out[key] = Array.isArray(p[key]) ? (p[key] as unknown[]).map(element1to2) : p[key];
    else if (key === 'version') out[key] = 2;
    else out[key] = p[key];
  }
  return out;
}

export type Migrated = { value: unknown; from?: number };

/**
 * Bring a parsed project file up to PROJECT_VERSION. `from` is set when a step ran (the version the
 * file had). A value that is not a project of a version this build reads comes back as it was.
 */
export function migrateProject(input: unknown): Migrated {
  if (!isObject(input) || input['format'] !== 'joulepath-project') return { value: input };
  const version = input['version'];
  if (version === 1) return { value: project1to2(input), from: 1 };
  return { value: input };
}
