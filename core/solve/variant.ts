/**
 * Re-solving a changed chain from a solved project: a motor start (the motor replaced by its
 * starting load), a capacitor bank added, a battery bank resized. `solveVariant` is the one way a
 * study solves anything but the base case; `variantProject` builds the changed project alone, for a
 * study that steps it itself (the battery discharge, through repeat.ts).
 *
 * Why no whole-project validation: the base came out of validateProject (its type, ValidProject,
 * says so). What may change is typed (VariantChange: whole elements replaced, added or removed, the
 * backup settings replaced or dropped, the pump duty dropped), and every changed part is checked here
 * as the file's validation checks it: each replaced or added element by its kind's schema and
 * checks (validateElement), new backup settings by their schema (validateBackup), and the tree's
 * shape again when elements come or go (checkStructure). So a study cannot smuggle in an invalid
 * element: it gets the same problems a file holding that element would get, and nothing is solved.
 * The parts left as they were are not checked again (they were valid and nothing in one element's
 * checks reads another element).
 */
import type { BackupStudy, Element } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { validateBackup, validateElement, type ValidProject } from './validate.ts';
import { checkStructure, skeletonOf } from './structure.ts';
import { solveValid, type Solved, type SolveOutcome } from './solved.ts';
import { countSolveStep } from './count.ts';

/** What a study may change in a solved project. */
export interface VariantChange {
  /** Elements put in place of the base's element of the same id (of any kind). */
  replace?: readonly Element[];
  /** New elements (ids the project does not hold), fed from elements it holds. */
  add?: readonly Element[];
  /** Ids of elements taken out (a whole branch: its elements below go too, or the tree check refuses). */
  remove?: ReadonlySet<string>;
  /** New backup study settings, or null to drop them (a variant whose loads the profile no longer matches). */
  backup?: BackupStudy | null;
  /** null drops the project's pump duty study. */
  pumpDuty?: null;
}

export type VariantOutcome = { ok: true; project: ValidProject } | { ok: false; problems: Problem[] };

/** The changed project, its changed parts checked (see the header); not solved. */
export function variantProject(base: Solved | ValidProject, change: VariantChange): VariantOutcome {
  countSolveStep('variants');
  const project: ValidProject = 'result' in base ? base.project : base;
  const problems: Problem[] = [];
  const checked = (raw: Element, i: number): Element | undefined => {
    const r = validateElement(raw, i);
    problems.push(...r.problems);
    return r.element;
  };
  // (The ids, and the new list of elements below, are built only when elements change.)
  const ids = change.replace?.length ? new Set(project.elements.map((e) => e.id)) : new Set<string>();
  const replaced = new Map<string, Element>();
  (change.replace ?? []).forEach((e, i) => {
    if (!ids.has(e.id)) problems.push({ code: 'unknown-element', elementId: e.id, field: 'id', value: e.id, message: 'names no element of the project: a variant replaces elements it holds' });
    const ok = checked(e, i);
    if (ok) replaced.set(e.id, ok);
  });
  const added: Element[] = [];
  (change.add ?? []).forEach((e, i) => {
    const ok = checked(e, i);
    if (ok) added.push(ok);
  });
  const remove = change.remove ?? new Set<string>();
  const elements = added.length || remove.size || replaced.size ? [...project.elements.filter((e) => !remove.has(e.id)).map((e) => replaced.get(e.id) ?? e), ...added] : project.elements;
  // The tree's shape when elements change (duplicate ids, feeds naming removed elements, loops, a second source).
  if (added.length || remove.size || replaced.size) {
    problems.push(...checkStructure(elements.map(skeletonOf).filter((s) => s !== null)));
  }
  let backup = project.backup;
  if (change.backup === null) backup = undefined;
  else if (change.backup !== undefined) {
    const b = validateBackup(change.backup);
    if (b.ok) backup = b.backup;
    else problems.push(...b.problems);
  }
  if (problems.length) return { ok: false, problems };
  const { backup: _b, pumpDuty, ...rest } = project;
  const next = {
    ...rest,
    ...(backup !== undefined ? { backup } : {}),
    ...(pumpDuty !== undefined && change.pumpDuty !== null ? { pumpDuty } : {}),
    elements,
  };
  // Checked above, part by part: the one place besides validateProject that gives the brand.
  return { ok: true, project: next as ValidProject };
}

/** Solve a changed chain from a solved project (see the header): counted apart from the base solve. */
export function solveVariant(base: Solved | ValidProject, change: VariantChange): SolveOutcome {
  const v = variantProject(base, change);
  if (!v.ok) return v;
  countSolveStep('variantSolves');
  return solveValid(v.project);
}
