/**
 * The next conductor size up, for one cable or for every cable with a conductor spec: the size
 * after the one the cable has now (the size the sizing chose for an "auto" cable, the size given
 * otherwise) in the size list of the table the cable is sized from (NEC Table 310.16's sizes,
 * IEC 60228 class 2's; core/conductors/catalogue.ts), fixed in the variant. A bigger conductor
 * drops less and loses less (R ∝ 1/A); the comparison shows what that costs and saves.
 */
import { PROJECT_LEVEL, type Problem } from '../model/errors.ts';
import type { Element } from '../model/project.ts';
import type { Solved } from '../solve/solved.ts';
import { defaultCatalogue, findSize, type ConductorCatalogue } from '../conductors/catalogue.ts';
import { elementWords } from '../model/field-labels.ts';
import type { QuickVariantOutcome } from './types.ts';

type Cable = Extract<Element, { kind: 'cable' }>;

/** The next size up of one cable, or a problem naming it. */
function nextOf(cable: Cable, solved: Solved, name: string, catalogue: ConductorCatalogue): { size: string } | Problem {
  const spec = cable.conductor;
  if (!spec) return { code: 'invalid-value', elementId: cable.id, field: 'resistancePerKm', value: cable.resistancePerKm, message: `"${name}" is given by its resistance, not by a conductor from the tables: give it a conductor to step its size` };
  const now = spec.size === 'auto' ? solved.result.elements.find((e) => e.id === cable.id)?.conductor?.size : spec.size;
  if (now === undefined) return { code: 'invalid-value', elementId: cable.id, field: 'conductor.size', value: spec.size, message: `"${name}" has no size chosen yet` };
  const sizes = spec.system === 'nec' ? catalogue.nec.sizes(spec.material) : catalogue.iec.sizes(spec.material);
  const i = findSize(sizes, now);
  if (i < 0) return { code: 'invalid-value', elementId: cable.id, field: 'conductor.size', value: now, message: `"${name}": ${now} is not a size of the table` };
  const next = sizes[i + 1];
  if (!next) return { code: 'invalid-value', elementId: cable.id, field: 'conductor.size', value: now, message: `"${name}" is at the table's largest size (${now}): add a parallel set instead` };
  return { size: next.label };
}

/**
 * The variant with the next conductor size up for `cableId`, or for every cable with a conductor
 * spec when it is null (cables given by their resistance are left as they are, and named in the note).
 */
export function nextSizeUpVariant(solved: Solved, cableId: string | null, catalogue: ConductorCatalogue = defaultCatalogue): QuickVariantOutcome {
  const { names } = elementWords(solved.project);
  const cables = solved.project.elements.filter((e): e is Cable => e.kind === 'cable' && (cableId === null || e.id === cableId));
  if (cableId !== null && cables.length === 0) {
    return { ok: false, problems: [{ code: 'unknown-element', elementId: cableId, field: 'id', value: cableId, message: 'names no cable of the project' }] };
  }
  const set: Record<string, Record<string, unknown>> = {};
  const steps: string[] = [];
  const skipped: string[] = [];
  const problems: Problem[] = [];
  for (const c of cables) {
    const name = names.get(c.id) ?? c.id;
    const r = nextOf(c, solved, name, catalogue);
    if ('code' in r) {
      if (cableId !== null) problems.push(r);
      else skipped.push(name);
      continue;
    }
    // Only the size: the conductor's other fields stay the plan's and follow its edits.
    set[c.id] = { conductor: { size: r.size } };
    steps.push(`${name} → ${r.size}`);
  }
  if (problems.length) return { ok: false, problems };
  if (steps.length === 0) {
    return { ok: false, problems: [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'variants', value: null, message: 'no cable has a conductor from the tables with a larger size to step to' }] };
  }
  const name = cableId === null ? 'Next size up, all cables' : `Next size up: ${names.get(cableId) ?? cableId}`;
  const note = [steps.join('; '), skipped.length ? `left as they are (given by their resistance or at the largest size): ${skipped.join(', ')}` : ''].filter((s) => s !== '').join('; ');
  return { ok: true, variant: { name, note, set } };
}
