/**
 * Turn a cable's conductor spec into a ladder of candidate sizes, each with its ampacity chain and
 * its resistance and reactance data, ready for the sizing step. Everything here depends only on the
 * spec and the port kind (not on the current), so it is done once per cable.
 *
 * Ampacity methods:
 * - NEC: the Table 310.16 value in the insulation-rating column × the Table 310.15(B)(1)(1) ambient
 *   factor × the Table 310.15(C)(1) adjustment factor, limited by the Table 310.16 value in the
 *   termination column (110.14(C): the lower of the insulation and termination ratings; 75 °C when
 *   the termination rating is not given, common practice for equipment above 100 A and a safe
 *   assumption below).
 * - IEC: the IEC 60364-5-52 Annex B capacity for the method, insulation and loaded conductors ×
 *   Table B.52.14 (ambient) × Table B.52.17 (grouping, bunched row).
 */
import type { CableStage, ConductorSpec, IecConductorSpec, NecConductorSpec, PortKind } from '../model.ts';
import type { Problem } from '../errors.ts';
import { type ConductorCatalogue, type SizeEntry, findSize } from './catalogue.ts';

/** One size on the ladder, with what the sizing step needs. Per conductor; Ω per metre. */
export interface Candidate {
  readonly index: number;
  readonly size: SizeEntry;
  /** Table value in the column the corrections apply to, A. */
  readonly table: number;
  /** table × ambient × grouping, A: the current at which the conductor reaches its rated temperature. */
  readonly corrected: number;
  /** Table value in the termination column (NEC 110.14(C)), A; undefined on IEC. */
  readonly terminationLimit: number | undefined;
  /** Ampacity after every limit, A. */
  readonly ampacity: number;
  /** Resistance at the reference temperature, Ω/m. */
  readonly rRef: number;
  /** Reactance, Ω/m (0 on DC). */
  readonly x: number;
  /** 240.4(D) limit on the protective device, A. */
  readonly deviceLimit: number | undefined;
}

export interface PreparedConductor {
  readonly spec: ConductorSpec;
  readonly kind: PortKind;
  readonly auto: boolean;
  /** The ladder, smallest first; for a fixed size only that size. */
  readonly candidates: readonly Candidate[];
  readonly ambient: number;
  readonly ambientFactor: number;
  readonly groupingFactor: number;
  /** What the grouping factor was read for, in words. */
  readonly groupingNote: string;
  readonly column: string;
  /** Reference temperature of rRef, °C, and the coefficient referred to it (R_T = R_ref·(1 + α(T − T_ref))). */
  readonly tRef: number;
  readonly alpha: number;
  /** Conductor temperature at which `corrected` is reached, °C. */
  readonly tMax: number;
  readonly continuousFactor: number;
  readonly parallelSets: number;
  readonly deviceRatings: readonly number[];
  readonly deviceList: string;
  readonly resistanceCite: string;
  readonly reactanceCite: string;
}

type Prepared = { ok: true; prepared: PreparedConductor } | { ok: false; problems: Problem[] };

const CONTINUOUS = 1.25; // NEC 210.19(A)(1)(a) / 215.2(A)(1)(a): 125 % of the continuous load

const defaultCount = (kind: PortKind): 2 | 3 => (kind === 'ac3' ? 3 : 2);

function problem(e: CableStage, field: string, value: unknown, message: string, code: Problem['code'] = 'outside-table'): Prepared {
  return { ok: false, problems: [{ code, elementId: e.id, field: `conductor.${field}`, value, message }] };
}

/** Keep the ladder from the fixed size only, or the whole ladder for "auto"; refuse an unknown size. */
function ladder(e: CableStage, spec: ConductorSpec, sizes: readonly SizeEntry[]): { ok: true; from: number; to: number } | { ok: false; out: Prepared } {
  if (spec.size === 'auto') return { ok: true, from: 0, to: sizes.length - 1 };
  const i = findSize(sizes, spec.size);
  if (i < 0) {
    return {
      ok: false,
      out: problem(e, 'size', spec.size, `unknown size "${spec.size}" for ${spec.material}; the table lists ${sizes.map((s) => s.label).join(', ')} (or "auto")`, 'invalid-value'),
    };
  }
  return { ok: true, from: i, to: i };
}

function prepareNec(e: CableStage, spec: NecConductorSpec, kind: PortKind, cat: ConductorCatalogue): Prepared {
  const t = cat.nec;
  const ambient = spec.ambient ?? 30;
  const insulation = spec.insulationRating;
  const termination = spec.terminationRating ?? 75;
  const limitColumn = Math.min(insulation, termination) as 60 | 75 | 90;
  const fa = t.ambientFactor(insulation, ambient);
  if (fa === undefined) {
    return problem(e, 'ambient', ambient, `${ambient} °C is beyond the ambient correction table (${t.cite.ambient}) for ${insulation} °C conductors, which ends at ${t.ambientMax(insulation)} °C`);
  }
  const count = spec.currentCarryingConductors ?? defaultCount(kind);
  const fadj = t.adjustmentFactor(count);
  const raceway = spec.raceway ?? 'pvc';
  const sizes = t.sizes(spec.material);
  const range = ladder(e, spec, sizes);
  if (!range.ok) return range.out;
  const candidates: Candidate[] = [];
  for (let i = range.from; i <= range.to; i++) {
    const size = sizes[i]!;
    const table = t.ampacity(spec.material, size.label, insulation);
    const limit = t.ampacity(spec.material, size.label, limitColumn);
    // DC: Table 8 (DC resistance). AC: Table 9 (AC resistance for the raceway) and its X_L.
    const rRef = kind === 'dc' ? t.dcResistance(spec.material, size.label) : t.acResistance(spec.material, size.label, raceway);
    const x = kind === 'dc' ? 0 : t.reactance(size.label, raceway);
    if (table === undefined || limit === undefined) {
      // A size not made in this material (no Table 310.16 cell) is left off the ladder.
      if (spec.size !== 'auto') return problem(e, 'size', spec.size, `${t.cite.ampacity} gives no ampacity for ${size.label} ${spec.material}`);
      continue;
    }
    if (rRef === undefined || x === undefined) {
      // A gap in the impedance table: refuse rather than skip the size (a skipped size could make
      // the choice larger than needed) or guess the value.
      return problem(
        e,
        'raceway',
        raceway,
        `${t.cite.acImpedance} as carried gives no AC resistance for ${size.label} ${spec.material} in ${raceway} raceway; choose another raceway (pvc has every size) or give the impedance explicitly`,
      );
    }
    const corrected = table * fa * fadj;
    candidates.push({
      index: i,
      size,
      table,
      corrected,
      terminationLimit: limit,
      ampacity: Math.min(corrected, limit),
      rRef,
      x,
      deviceLimit: t.smallConductorLimit(spec.material, size.label),
    });
  }
  if (candidates.length === 0) return problem(e, 'raceway', raceway, `the tables give no ${spec.material} sizes with AC resistance in ${raceway} raceway`);
  return {
    ok: true,
    prepared: {
      spec,
      kind,
      auto: spec.size === 'auto',
      candidates,
      ambient,
      ambientFactor: fa,
      groupingFactor: fadj,
      groupingNote: `${count} current-carrying conductors (${t.cite.adjustment})`,
      column: `${t.cite.ampacity}, ${spec.material} ${insulation} °C column${limitColumn < insulation ? `, limited by the ${limitColumn} °C column (termination rating, NEC 110.14(C))` : ''}`,
      tRef: 75,
      alpha: t.alpha75(spec.material),
      tMax: insulation,
      continuousFactor: spec.continuous ? CONTINUOUS : 1,
      parallelSets: e.parallelSets ?? 1,
      deviceRatings: t.deviceRatings,
      deviceList: t.cite.devices,
      resistanceCite: kind === 'dc' ? t.cite.dcResistance : `${t.cite.acImpedance}, ${raceway} raceway`,
      reactanceCite: kind === 'dc' ? 'none on DC' : `${t.cite.acImpedance}, ${raceway} raceway`,
    },
  };
}

function prepareIec(e: CableStage, spec: IecConductorSpec, kind: PortKind, cat: ConductorCatalogue): Prepared {
  const t = cat.iec;
  const ambient = spec.ambient ?? 30;
  const methods = t.methods(spec.material, spec.insulation);
  if (!methods.includes(spec.installationMethod)) {
    return problem(
      e,
      'installationMethod',
      spec.installationMethod,
      methods.length
        ? `no published capacities for method ${spec.installationMethod} with ${spec.insulation.toUpperCase()} ${spec.material} in ${t.cite.capacity}; methods with data: ${methods.join(', ')}`
        : `no published capacities for ${spec.insulation.toUpperCase()} ${spec.material} in ${t.cite.capacity}`,
    );
  }
  const ca = t.ambientFactor(spec.insulation, ambient);
  if (ca === undefined) {
    return problem(e, 'ambient', ambient, `${ambient} °C is beyond the ambient correction table (${t.cite.ambient}) for ${spec.insulation.toUpperCase()}, which ends at ${t.ambientMax(spec.insulation)} °C`);
  }
  const circuits = spec.groupedCircuits ?? 1;
  const cg = t.groupingFactor(circuits);
  if (cg === undefined) {
    return problem(e, 'groupedCircuits', circuits, `${circuits} circuits is beyond the grouping table (${t.cite.grouping}), which ends at ${t.groupingMax}`);
  }
  const loaded = spec.loadedConductors ?? defaultCount(kind);
  const sizes = t.sizes(spec.material);
  const range = ladder(e, spec, sizes);
  if (!range.ok) return range.out;
  const candidates: Candidate[] = [];
  for (let i = range.from; i <= range.to; i++) {
    const size = sizes[i]!;
    const table = t.capacity(spec.material, spec.insulation, spec.installationMethod, loaded, size.label);
    const rRef = t.resistance20(spec.material, size.label);
    if (table === undefined || rRef === undefined) {
      if (spec.size !== 'auto') return problem(e, 'size', spec.size, `the tables give no ${table === undefined ? 'capacity' : 'resistance'} for ${size.label} ${spec.material}, method ${spec.installationMethod}`);
      continue;
    }
    const corrected = table * ca * cg;
    candidates.push({ index: i, size, table, corrected, terminationLimit: undefined, ampacity: corrected, rRef, x: kind === 'dc' ? 0 : t.defaultReactance, deviceLimit: undefined });
  }
  if (candidates.length === 0) return problem(e, 'installationMethod', spec.installationMethod, `no sizes with capacities for method ${spec.installationMethod}`);
  return {
    ok: true,
    prepared: {
      spec,
      kind,
      auto: spec.size === 'auto',
      candidates,
      ambient,
      ambientFactor: ca,
      groupingFactor: cg,
      groupingNote: `${circuits} circuit${circuits === 1 ? '' : 's'} grouped, bunched (${t.cite.grouping})`,
      column: `${t.cite.capacity}, method ${spec.installationMethod}, ${spec.insulation.toUpperCase()}, ${loaded} loaded conductors, ${spec.material}`,
      tRef: 20,
      alpha: t.alpha20(spec.material),
      tMax: t.maxTemperature(spec.insulation),
      continuousFactor: spec.continuous ? CONTINUOUS : 1,
      parallelSets: e.parallelSets ?? 1,
      deviceRatings: t.deviceRatings,
      deviceList: t.cite.devices,
      resistanceCite: t.cite.resistance,
      reactanceCite: kind === 'dc' ? 'none on DC' : t.cite.reactance,
    },
  };
}

/** Prepare a cable's conductor spec for sizing at its port kind; problems name the field. */
export function prepareConductor(e: CableStage, spec: ConductorSpec, kind: PortKind, catalogue: ConductorCatalogue): Prepared {
  return spec.system === 'nec' ? prepareNec(e, spec, kind, catalogue) : prepareIec(e, spec, kind, catalogue);
}
