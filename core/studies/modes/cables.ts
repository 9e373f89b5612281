/**
 * One cable size across the modes (part of the modes study, study.ts). Each case the modes study solves
 * sizes the cables it carries for its own currents (conductor specs "auto", core/solve/size-conductors.ts):
 * on supply (the bank on float), on supply recharging the bank (the charger at A = L + k·C/H) and on
 * battery. A cable is pulled once, so its size is the largest any case needs (by copper area: one
 * conductor's cross-section × parallel sets), and the case that set it is named. On equal sizes the
 * first case in the order supply, battery, recharge is named (the file as drawn first).
 */
import type { ConductorResult, SolveResult } from '../../model/result.ts';

export type CableCase = 'supply' | 'battery' | 'recharge';

/** One cable's size in each case (null where the case does not carry it) and the one size to use. */
export interface CableAcrossModes {
  elementId: string;
  name: string;
  sizes: Record<CableCase, string | null>;
  /** The largest size its cases need: the one to pull. */
  governing: string;
  /** The case that needs it. */
  governingCase: CableCase;
}

/** The words of a case, for "sized for the recharge case". */
export const CASE_WORDS: Readonly<Record<CableCase, string>> = {
  supply: 'the on-supply case (the bank on float)',
  battery: 'the on-battery case',
  recharge: 'the recharge case',
};

const label = (c: ConductorResult): string => (c.parallelSets > 1 ? `${c.parallelSets} × ${c.size}` : c.size);
/** Copper (or aluminium) area of the link, mm²: the size's cross-section × parallel sets. */
const area = (c: ConductorResult): number => c.areaMm2 * c.parallelSets;

/** Every sized cable of the cases (in the on-supply result's order, then any the others add) with its one size. */
export function cablesAcrossModes(cases: Readonly<Record<CableCase, SolveResult | undefined>>): CableAcrossModes[] {
  const order: CableCase[] = ['supply', 'battery', 'recharge'];
  const maps = order.map((k) => new Map((cases[k]?.elements ?? []).filter((e) => e.kind === 'cable' && e.conductor).map((e) => [e.id, e])));
  const ids: string[] = [];
  const seen = new Set<string>();
  for (const m of maps) {
    for (const id of m.keys()) {
      if (!seen.has(id)) {
        seen.add(id);
        ids.push(id);
      }
    }
  }
  return ids.map((id) => {
    const sizes = { supply: null, battery: null, recharge: null } as Record<CableCase, string | null>;
    let best: ConductorResult | undefined;
    let bestCase: CableCase = 'supply';
    let name = id;
    for (let i = 0; i < order.length; i++) {
      const e = maps[i]!.get(id);
      if (!e?.conductor) continue;
      name = e.name;
      sizes[order[i]!] = label(e.conductor);
      if (best === undefined || area(e.conductor) > area(best)) {
        best = e.conductor;
        bestCase = order[i]!;
      }
    }
    // Every id came from a case that sized it, so `best` is set.
    return { elementId: id, name, sizes, governing: label(best!), governingCase: bestCase };
  });
}
