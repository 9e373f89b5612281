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
import type { CableStage, ConductorSpec, IecConductorSpec, NecConductorSpec, PortKind } from '../model/project.ts';
import type { Problem } from '../model/errors.ts';
import { type ConductorCatalogue, type SizeEntry, findSize } from './catalogue.ts';

/** One size on the ladder, with what the sizing step needs. Per conductor; Ω per metre. */
export interface Candidate {
  readonly index: number;
  readonly size: SizeEntry;
  /** Table value in the column the corrections apply to (the insulation rating), A. */
  readonly table: number;
  /** table × ambient × adjustment (grouping), A: the current at which the conductor reaches its rated temperature. */
  readonly corrected: number;
  /** NEC: Table 310.16 values of this size in the 60, 75 and 90 °C columns (for 110.14(C)); empty on IEC. */
  readonly columns: Readonly<Partial<Record<60 | 75 | 90, number>>>;
  /** NEC: a size from 14 AWG to 1 AWG (110.14(C)(1)(a)). */
  readonly smallAwg: boolean;
  /** Resistance at the reference temperature, Ω/m (for the operating-temperature estimate). */
  readonly rRef: number;
  /** Reactance, Ω/m (0 on DC). */
  readonly x: number;
  /** Resistance of the drop method, Ω/m: NEC Chapter 9 Table 9 / Table 8 at 75 °C; IEC Annex G ρ₁/S. */
  readonly rMethod: number;
  /** 240.4(D) limit on the protective device, A (per conductor). */
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
  /** NEC: insulation rating (the correction column), °C. */
  readonly insulation: 60 | 75 | 90 | undefined;
  /** NEC: termination rating the user marked, °C (absent: 110.14(C)(1) decides per circuit). */
  readonly terminationGiven: 60 | 75 | 90 | undefined;
  /** Reference temperature of rRef, °C, and the coefficient referred to it (R_T = R_ref·(1 + α(T − T_ref))). */
  readonly tRef: number;
  readonly alpha: number;
  /** Conductor temperature at which `corrected` is reached, °C. */
  readonly tMax: number;
  readonly parallelSets: number;
  readonly deviceRatings: readonly number[];
  readonly deviceList: string;
  /** IEC: overload device type and its conventional operating current I₂ as a multiple of I_n. */
  readonly iecDevice?: { type: 'circuit-breaker' | 'gG-fuse'; words: string; i2Multiple: (rating: number) => number; i2Cite: string };
  readonly resistanceCite: string;
  readonly reactanceCite: string;
  /** The drop method's resistance, in words. */
  readonly methodCite: string;
  /** Sizes left off the ladder and why (parallel sets below 1/0 AWG). */
  readonly excluded?: string;
}

type Prepared = { ok: true; prepared: PreparedConductor } | { ok: false; problems: Problem[] };

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

/** NEC sizes 14 AWG to 1 AWG: the range 110.14(C)(1)(a) names. */
const SMALL_AWG = /^(14|12|10|8|6|4|3|2|1) AWG$/;
/** NEC 310.10(G)(1): conductors in parallel only at 1/0 AWG and larger. */
const PARALLEL_FROM = '1/0 AWG';

function prepareNec(e: CableStage, spec: NecConductorSpec, kind: PortKind, cat: ConductorCatalogue): Prepared {
  const t = cat.nec;
  const ambient = spec.ambient ?? 30;
  const insulation = spec.insulationRating;
  const fa = t.ambientFactor(insulation, ambient);
  if (fa === undefined) {
    return problem(e, 'ambient', ambient, `${ambient} °C is beyond the ambient correction table (${t.cite.ambient}) for ${insulation} °C conductors, which ends at ${t.ambientMax(insulation)} °C`);
  }
  const sets = e.parallelSets ?? 1;
  // 310.15(C)(1): every set of the link counts toward the current-carrying conductors in the raceway.
  const perSet = defaultCount(kind);
  const count = (spec.currentCarryingConductors ?? perSet) + (sets - 1) * perSet;
  const fadj = t.adjustmentFactor(count);
  const raceway = spec.raceway ?? 'pvc';
  const sizes = t.sizes(spec.material);
  const range = ladder(e, spec, sizes);
  if (!range.ok) return range.out;
  const firstParallel = findSize(sizes, PARALLEL_FROM);
  if (sets > 1 && spec.size !== 'auto' && range.from < firstParallel) {
    return problem(e, 'size', spec.size, `conductors in parallel must be ${PARALLEL_FROM} or larger (NEC 310.10(G)(1)); ${spec.size} cannot run in ${sets} sets`, 'invalid-value');
  }
  const from = sets > 1 ? Math.max(range.from, firstParallel) : range.from;
  const candidates: Candidate[] = [];
  for (let i = from; i <= range.to; i++) {
    const size = sizes[i]!;
    const table = t.ampacity(spec.material, size.label, insulation);
    const columns: Partial<Record<60 | 75 | 90, number>> = {};
    for (const col of [60, 75, 90] as const) {
      const v = t.ampacity(spec.material, size.label, col);
      if (v !== undefined) columns[col] = v;
    }
    // DC: Table 8 (DC resistance). AC: Table 9 (AC resistance for the raceway) and its X_L. Both
    // at 75 °C: the drop method's own basis (Table 9 Note 2).
    const rRef = kind === 'dc' ? t.dcResistance(spec.material, size.label) : t.acResistance(spec.material, size.label, raceway);
    const x = kind === 'dc' ? 0 : t.reactance(size.label, raceway);
    if (table === undefined) {
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
    candidates.push({
      index: i,
      size,
      table,
      corrected: table * fa * fadj,
      columns,
      smallAwg: SMALL_AWG.test(size.label),
      rRef,
      x,
      rMethod: rRef,
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
      groupingNote: `${count} current-carrying conductors${sets > 1 ? ` (${sets} parallel sets counted, 310.15(C)(1))` : ''} (${t.cite.adjustment})`,
      column: `${t.cite.ampacity}, ${spec.material} ${insulation} °C column`,
      insulation,
      terminationGiven: spec.terminationRating,
      tRef: 75,
      alpha: t.alpha75(spec.material),
      tMax: insulation,
      parallelSets: sets,
      deviceRatings: t.deviceRatings,
      deviceList: t.cite.devices,
      resistanceCite: kind === 'dc' ? t.cite.dcResistance : `${t.cite.acImpedance}, ${raceway} raceway`,
      reactanceCite: kind === 'dc' ? 'none on DC' : `${t.cite.acImpedance}, ${raceway} raceway`,
      methodCite:
        kind === 'dc'
          ? `${t.cite.dcResistance}: ΔV = 2·I·R·L`
          : `${t.cite.acImpedance}, ${raceway} raceway, effective Z = R·cosθ + X·sinθ (Table 9 Note 2): ΔV = ${kind === 'ac3' ? '√3' : '2'}·I·Z_e·L`,
      ...(sets > 1 && range.from < firstParallel ? { excluded: `sizes below ${PARALLEL_FROM} are not offered in parallel (NEC 310.10(G)(1))` } : {}),
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
  const sets = e.parallelSets ?? 1;
  // Each parallel set is one more circuit in the group (Table B.52.17).
  const circuits = (spec.groupedCircuits ?? 1) + sets - 1;
  const cg = t.groupingFactor(circuits);
  if (cg === undefined) {
    return problem(e, 'groupedCircuits', spec.groupedCircuits ?? 1, `${circuits} circuits${sets > 1 ? ` (with ${sets} parallel sets)` : ''} is beyond the grouping table (${t.cite.grouping}), which ends at ${t.groupingMax}`);
  }
  const loaded = spec.loadedConductors ?? defaultCount(kind);
  const sizes = t.sizes(spec.material);
  const range = ladder(e, spec, sizes);
  if (!range.ok) return range.out;
  const rho1 = t.rho1(spec.material);
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
    candidates.push({
      index: i,
      size,
      table,
      corrected,
      columns: {},
      smallAwg: false,
      rRef,
      x: kind === 'dc' ? 0 : t.defaultReactance,
      // Annex G: R = ρ₁·L/S with ρ₁ = 1.25·ρ₂₀ (Ω·m / m² = Ω/m).
      rMethod: rho1 / (size.areaMm2 * 1e-6),
      deviceLimit: undefined,
    });
  }
  if (candidates.length === 0) return problem(e, 'installationMethod', spec.installationMethod, `no sizes with capacities for method ${spec.installationMethod}`);
  const type = spec.deviceType ?? 'circuit-breaker';
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
      groupingNote: `${circuits} circuit${circuits === 1 ? '' : 's'} grouped${sets > 1 ? ` (${sets} parallel sets counted)` : ''}, bunched (${t.cite.grouping})`,
      column: `${t.cite.capacity}, method ${spec.installationMethod}, ${spec.insulation.toUpperCase()}, ${loaded} loaded conductors, ${spec.material}`,
      insulation: undefined,
      terminationGiven: undefined,
      tRef: 20,
      alpha: t.alpha20(spec.material),
      tMax: t.maxTemperature(spec.insulation),
      parallelSets: sets,
      deviceRatings: type === 'gG-fuse' ? t.fuseRatings : t.deviceRatings,
      deviceList: type === 'gG-fuse' ? t.cite.fuses : t.cite.devices,
      iecDevice:
        type === 'gG-fuse'
          ? { type, words: 'gG fuse', i2Multiple: t.fuseI2Multiple, i2Cite: t.cite.fuseI2 }
          : { type, words: 'circuit-breaker', i2Multiple: () => t.breakerI2Multiple, i2Cite: t.cite.breakerI2 },
      resistanceCite: t.cite.resistance,
      reactanceCite: kind === 'dc' ? 'none on DC' : t.cite.reactance,
      methodCite: `IEC 60364-5-52 Annex G: u = b·(ρ₁·L·cosφ/S + λ·L·sinφ)·I_B, ρ₁ = 1.25·ρ₂₀ = ${(rho1 * 1e6).toPrecision(3)} Ω·mm²/m${kind === 'dc' ? ' (cosφ = 1 on DC)' : ', λ = 0.08 mΩ/m'}, b = ${kind === 'ac3' ? 1 : 2}`,
    },
  };
}

/** Prepare a cable's conductor spec for sizing at its port kind; problems name the field. */
export function prepareConductor(e: CableStage, spec: ConductorSpec, kind: PortKind, catalogue: ConductorCatalogue): Prepared {
  return spec.system === 'nec' ? prepareNec(e, spec, kind, catalogue) : prepareIec(e, spec, kind, catalogue);
}
