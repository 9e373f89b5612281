/**
 * Whole-path voltage drop: for each load — and for each regulating converter's input, whose
 * supply voltage matters as much — the cable links between it and the nearest upstream
 * point that sets the voltage afresh — the source's terminals or the output of a regulating
 * converter (a kind with the `regulatesVoltage` trait: rectifier, DC-DC, inverter, drive, generic
 * stage), which holds its set point whatever the drop upstream — with each link's drop as a percentage, summed: a sized conductor's drop check
 * by its method (% of the nominal voltage, core/conductors/size.ts), a link given by its impedance
 * with its solved drop (% of its own sending voltage).
 *
 * Counted: cable links (the conductors: NEC's "feeders and branch circuits", IEC 60364-5-52
 * Annex G's "from the origin of the installation"). Not counted: a transformer's own regulation
 * and a source's internal impedance, which are not conductor drops (they show in the voltages).
 * Summing percentages of each link's own sending voltage is the usual way the limits are applied;
 * it equals the exact relative drop to first order.
 */
import { z } from 'zod/mini';
import type { DropLimits } from '../model/project.ts';
import type { ElementResult, PathDrop } from '../model/result.ts';
import { regulatesVoltage } from '../kinds/index.ts';

/** Schema of the project's optional `dropLimits` (used by core/solve/validate.ts). */
export const dropLimitsSchema = z.strictObject({
  basis: z.optional(
    z.enum(['nec-informational', 'iec-a-lighting', 'iec-a-other', 'iec-b-lighting', 'iec-b-other'], {
      error: 'must be "nec-informational", "iec-a-lighting", "iec-a-other", "iec-b-lighting" or "iec-b-other"',
    }),
  ),
  perLinkPercent: z.optional(z.number({ error: 'must be a number (%)' }).check(z.gt(0, 'must be greater than 0 %'), z.lte(100, 'must not exceed 100 %'))),
  totalPercent: z.optional(z.number({ error: 'must be a number (%)' }).check(z.gt(0, 'must be greater than 0 %'), z.lte(100, 'must not exceed 100 %'))),
});

export interface ResolvedLimits {
  perLinkPercent?: number;
  totalPercent: number;
  basis: string;
}

const BASES: Record<NonNullable<DropLimits['basis']>, { perLink?: number; total: number; words: string }> = {
  'nec-informational': {
    perLink: 3,
    total: 5,
    words: 'NEC 210.19(A) IN No. 3 / 215.2(A) IN No. 2 (informational notes, not enforceable on their own): 3 % per link, 5 % total',
  },
  'iec-a-lighting': { total: 3, words: 'IEC 60364-5-52:2009 Annex G (informative), Table G.52.1, type A (public LV supply), lighting: 3 %' },
  'iec-a-other': { total: 5, words: 'IEC 60364-5-52:2009 Annex G (informative), Table G.52.1, type A (public LV supply), other uses: 5 %' },
  'iec-b-lighting': { total: 6, words: 'IEC 60364-5-52:2009 Annex G (informative), Table G.52.1, type B (private supply), lighting: 6 %' },
  'iec-b-other': { total: 8, words: 'IEC 60364-5-52:2009 Annex G (informative), Table G.52.1, type B (private supply), other uses: 8 %' },
};

/** The limits in force: the chosen basis (NEC informational 3 %/5 % by default) with the user's overrides. */
export function resolveLimits(limits: DropLimits | undefined): ResolvedLimits {
  const base = BASES[limits?.basis ?? 'nec-informational'];
  const perLink = limits?.perLinkPercent ?? base.perLink;
  const total = limits?.totalPercent ?? base.total;
  const overridden = limits?.perLinkPercent !== undefined || limits?.totalPercent !== undefined;
  const basis = overridden ? `chosen by the user (${perLink !== undefined ? `${perLink} % per link, ` : ''}${total} % total)` : base.words;
  return perLink !== undefined ? { perLinkPercent: perLink, totalPercent: total, basis } : { totalPercent: total, basis };
}

/** The allowed drop on one link for sizing: its own setting, else the per-link limit, else the total. */
export const linkLimit = (own: number | undefined, limits: ResolvedLimits): number => own ?? limits.perLinkPercent ?? limits.totalPercent;

/** Cumulative drop from the path's start to every load and converter input, flagged against the limits. */
export function pathDrops(
  elements: readonly ElementResult[],
  limits: ResolvedLimits,
  perLinkOwn: ReadonlyMap<string, number> = new Map(),
  checked: ReadonlyMap<string, number> = new Map(),
  planned?: { feeders: readonly number[]; regulates: readonly boolean[] },
): PathDrop[] {
  // Each element's feeder (its place in the list, −1 for none) and whether it sets the voltage
  // afresh: `planned` when the caller knows them, as the solve does from its plan, else found by id
  // and kind; once, so that the walks up from each load below read arrays only.
  const n = elements.length;
  let parentOf: readonly number[];
  let regulates: readonly boolean[];
  if (planned !== undefined && planned.feeders.length === n && planned.regulates.length === n) {
    parentOf = planned.feeders;
    regulates = planned.regulates;
  } else {
    const at = new Map<string, number>();
    for (let i = 0; i < n; i++) at.set(elements[i]!.id, i);
    parentOf = elements.map((e) => (e.from !== undefined ? (at.get(e.from) ?? -1) : -1));
    regulates = elements.map((e) => regulatesVoltage(e.kind));
  }
  const out: PathDrop[] = [];
  for (let li = 0; li < n; li++) {
    const load = elements[li]!;
    if (load.role !== 'load' && !regulates[li]) continue;
    const links: PathDrop['links'] = [];
    let terminal: ElementResult = load;
    let k = li;
    let start: ElementResult | undefined;
    for (let pk = parentOf[k]!; pk >= 0; k = pk, pk = parentOf[k]!) {
      const parent = elements[pk]!;
      // The load's electrical terminals: for a shaft load, the motor's input.
      if (terminal.input?.kind === 'shaft' && parent.input && parent.input.kind !== 'shaft') terminal = parent;
      if (parent.role === 'source' || regulates[pk]) {
        start = parent;
        break;
      }
      if (parent.kind === 'cable' && parent.input && parent.output && parent.input.voltage > 0) {
        // A sized conductor counts with its drop check by the method (% of nominal); a link given by
        // its impedance with the solved drop (% of its sending voltage).
        const pct = checked.get(parent.id) ?? (100 * (parent.input.voltage - parent.output.voltage)) / parent.input.voltage;
        const limit = linkLimit(perLinkOwn.get(parent.id), limits);
        // Collected load-first, put in source-first order below (one reverse, not a shift per link).
        links.push({ id: parent.id, dropPercent: pct, exceedsLimit: pct > limit * (1 + 1e-12) });
      }
    }
    if (!start?.output) continue;
    links.reverse();
    // Σ in source-first order from 0 (as a reduce would), and whether any link is over its limit.
    let totalPercent = 0;
    let anyOver = false;
    for (let j = 0; j < links.length; j++) {
      totalPercent += links[j]!.dropPercent;
      if (links[j]!.exceedsLimit) anyOver = true;
    }
    const exceeds = totalPercent > limits.totalPercent * (1 + 1e-12) || anyOver;
    const startVoltage = start.output.voltage;
    const loadVoltage = terminal.input?.voltage ?? 0;
    // Two literals rather than a spread: the same fields in the same order, with or without the per-link limit.
    out.push(
      limits.perLinkPercent !== undefined
        ? { loadId: load.id, startId: start.id, startVoltage, loadVoltage, links, totalPercent, perLinkLimitPercent: limits.perLinkPercent, totalLimitPercent: limits.totalPercent, limitBasis: limits.basis, exceedsLimit: exceeds }
        : { loadId: load.id, startId: start.id, startVoltage, loadVoltage, links, totalPercent, totalLimitPercent: limits.totalPercent, limitBasis: limits.basis, exceedsLimit: exceeds },
    );
  }
  return out;
}
