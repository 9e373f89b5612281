/**
 * Prospective short-circuit currents and the devices that must interrupt them.
 *
 * Battery (DC), method: the bank as a voltage behind its internal resistance (Thévenin model, the
 * one the solve uses): I_sc = E / (R_internal + R_cables to the point), each DC cable counted go and
 * return (2 × length), parallel sets dividing R. The voltage E is the worst case, not the state of
 * charge of the backup study: IEC 61660-1:1997 (short-circuit currents in d.c. auxiliary
 * installations) takes the battery fully charged for the maximum short-circuit current, its
 * open-circuit voltage E_B (its clause on stationary lead-acid batteries; from memory, the clause
 * number not checked against the printed standard, so the text names the clause by its subject; a
 * public summary of the standard agrees that E_B is the open-circuit voltage). A
 * bank held by a charger sits at its charge voltage, above that open-circuit voltage, so this study
 * takes the higher of the two: the fully charged open-circuit voltage (OCV curve at state of charge
 * 1) and the charge (absorption) voltage, both per cell × cells in series, from the bank's preset or
 * datasheet overrides. A battery given by its voltage alone uses that voltage (said so). A bolted
 * fault; arc resistance and the bank's own connection resistances would lower it, a charger's own
 * current-limited contribution would add a little (neither counted).
 *
 * AC, method: IEC 60909-0 equivalent voltage source at the fault location, three-phase bolted
 * fault: I″k = c·U_n / (√3·|Z_k|) (single-phase interfaces: the loop, I″k = c·U_n / |Z_loop|, the
 * same principle), with c = c_max from IEC 60909-0 Table 1 (core/data/iec-60909.ts), Z_k the sum of
 * - the source: grid Z_Q = c·U²/S″kQ with R_Q/X_Q from the project (default 0.1, IEC 60909-0 6.2),
 *   or the R + jX entered; generator X″d (on its rating) with the R entered;
 * - transformers: Z_T = u_k·U_r²/S_r, R_T = P_load/S_r · U_r²/S_r, X_T = √(Z_T² − R_T²), times
 *   K_T = 0.95·c_max/(1 + 0.6·x_T) (IEC 60909-0 6.3.3); impedances upstream referred through the
 *   ratio squared;
 * - cables: R at 20 °C (the maximum-current case of IEC 60909-0) + jX; explicit impedances as entered.
 * Motor contributions and the generator correction factor K_G are not included (stated in the result).
 */
import type { AcSource, BatterySource, CableStage, Element, Project, TransformerStage } from '../../model/project.ts';
import type { ConductorResult, SolveResult } from '../../model/result.ts';
import type { Problem } from '../../model/errors.ts';
import { batteryEquivalent } from '../../kinds/battery.ts';
import { bankOcv, resolveBank } from '../../physics/bank.ts';
import { CONDUCTOR_MATERIALS } from '../../data/conductor-materials.ts';
import { FEEDER_R_OVER_X, IEC_60909_VOLTAGE_FACTORS, KT_NUMERATOR, KT_XT_COEFFICIENT } from '../../data/iec-60909.ts';
import type { DeviceCheck, FaultPoint, SurgeStudyResult } from './types.ts';

const SQRT3 = Math.sqrt(3);

export const BATTERY_FAULT_METHOD =
  'Bolted fault: I_sc = E / (R_internal + R of the DC cables to the point), cables go and return; E is the worst case: the higher of the fully charged open-circuit voltage (IEC 61660-1 takes the battery fully charged for the maximum short-circuit current) and the charge voltage a charger holds the bank at; arc and connection resistances and a charger’s own contribution not counted.';

/** The voltage a battery fault is worked at (IEC 61660-1 maximum case, or the charge voltage), and why. */
export function batteryFaultVoltage(e: BatterySource): { voltage: number; basis: string } {
  if (!e.bank) {
    return { voltage: e.voltage!, basis: `the bank voltage as entered, ${e.voltage} V (give the bank's cells and chemistry to work it at the fully charged and the charge voltage)` };
  }
  const bank = resolveBank(e.bank, e.internalResistance);
  const full = bankOcv(bank, 1);
  const charge = bank.values.chargeCellVoltage * bank.cellsInSeries;
  const n = bank.cellsInSeries;
  return charge > full
    ? { voltage: charge, basis: `the charge voltage ${fmtV(charge)} (${bank.values.chargeCellVoltage} V × ${n} cells), above the fully charged open-circuit voltage ${fmtV(full)} (IEC 61660-1, battery clause)` }
    : { voltage: full, basis: `the fully charged open-circuit voltage ${fmtV(full)} (IEC 61660-1, battery clause: the battery fully charged), at or above the charge voltage ${fmtV(charge)}` };
}

const fmtV = (v: number): string => `${v.toPrecision(4)} V`;
export const AC_FAULT_METHOD =
  'IEC 60909-0 equivalent voltage source, three-phase bolted fault I″k = c·U_n / (√3·|Z_k|) (single-phase: the loop, c·U_n / |Z_loop|); c = c_max of IEC 60909-0 Table 1; transformer K_T = 0.95·c_max/(1 + 0.6·x_T); cables at 20 °C. Motor contributions and the generator factor K_G are not included.';

/** c_max for a nominal voltage and the low-voltage system's tolerance (IEC 60909-0:2016 Table 1). */
export function voltageFactor(nominalVoltage: number, tolerancePercent: 6 | 10): number {
  const row = IEC_60909_VOLTAGE_FACTORS.find((r) => nominalVoltage <= r.maxNominalVoltage && (r.tolerancePercent === null || r.tolerancePercent === tolerancePercent))!;
  return row.cMax;
}

/**
 * A grid's feeder impedance from its short-circuit power (IEC 60909-0:2016 6.2, eq. 6):
 * Z_Q = c·U_n²/S″kQ with c = c_max of Table 1, X_Q = Z_Q/√(1 + (R/X)²), R_Q = (R/X)·X_Q, R/X as
 * entered or 0.1 (6.2). Per phase (star equivalent) on three-phase; the loop on single-phase.
 * Null without a short-circuit power.
 */
export function feederImpedance(root: AcSource): { r: number; x: number; z: number; c: number; rToX: number } | null {
  if (root.kind !== 'grid' || root.shortCircuitPower === undefined) return null;
  const c = voltageFactor(root.voltage, root.voltageTolerancePercent ?? 10);
  const z = (c * root.voltage * root.voltage) / root.shortCircuitPower;
  const rToX = root.shortCircuitRToX ?? FEEDER_R_OVER_X;
  const x = z / Math.sqrt(1 + rToX * rToX);
  return { r: rToX * x, x, z, c, rToX };
}

/** Conductor resistance at 20 °C from a sized link's table value (linear law R_T = R₂₀·[1 + α₂₀(T − 20)]). */
function r20PerKm(c: ConductorResult): number {
  const alpha = CONDUCTOR_MATERIALS.find((m) => m.material === (c.material === 'copper' ? 'Cu' : 'Al'))!.alpha20PerK;
  return c.resistance.referencePerKm / (1 + alpha * (c.resistance.referenceTemperature - 20));
}

/** Cable impedance per phase (3φ) or of the loop (DC, 1φ), Ω, for a fault study. */
function cableZ(e: CableStage, kind: 'dc' | 'ac1' | 'ac3', conductor: ConductorResult | undefined): { r: number; x: number } {
  const loops = kind === 'ac3' ? 1 : 2;
  const km = (e.length * loops) / 1000 / (e.parallelSets ?? 1);
  const rPerKm = conductor ? r20PerKm(conductor) : e.resistancePerKm!;
  const xPerKm = conductor ? conductor.reactancePerKm : (e.reactancePerKm ?? 0);
  return { r: rPerKm * km, x: kind === 'dc' ? 0 : xPerKm * km };
}

interface Walk {
  points: FaultPoint[];
  /** Battery: the voltage the fault is worked at, in words. */
  voltageBasis?: string;
  /** Prospective current at each element's output (for the devices at the sending end of what it feeds). */
  atOutput: Map<string, FaultPoint>;
}

function childrenOf(elements: readonly Element[]): Map<string, Element[]> {
  const m = new Map<string, Element[]>();
  for (const e of elements) {
    if (!('from' in e) || e.from === undefined) continue;
    const siblings = m.get(e.from);
    if (siblings) siblings.push(e);
    else m.set(e.from, [e]);
  }
  return m;
}

/** Battery fault study: bank terminals and the far end of every DC cable up to the first converter. */
export function batteryFaults(project: Project, result: SolveResult): { ok: true; walk: Walk } | { ok: false; problems: Problem[] } {
  const root = project.elements.find((e) => e.kind === 'battery') as BatterySource | undefined;
  const walk: Walk = { points: [], atOutput: new Map() };
  if (!root) return { ok: true, walk };
  const eq = batteryEquivalent(root);
  if (!(eq.resistance > 0)) {
    const field = root.internalResistance !== undefined ? 'internalResistance' : root.bank ? 'bank.overrides.internalResistanceOhmAh' : 'internalResistance';
    const given = root.internalResistance !== undefined || root.bank?.overrides?.internalResistanceOhmAh !== undefined;
    return {
      ok: false,
      problems: [
        {
          code: 'invalid-value',
          elementId: root.id,
          field,
          value: given ? 0 : undefined,
          message: `${given ? 'is 0' : 'is not given (0 Ω)'}: the bank’s prospective short-circuit current would be infinite; enter the internal resistance from the cell or block datasheet`,
        },
      ],
    };
  }
  const res = new Map(result.elements.map((e) => [e.id, e]));
  const kids = childrenOf(project.elements);
  const worst = batteryFaultVoltage(root);
  const emf = worst.voltage;
  walk.voltageBasis = worst.basis;
  const terminals: FaultPoint = { elementId: root.id, location: 'bank terminals', portKind: 'dc', voltage: emf, impedance: eq.resistance, r: eq.resistance, x: 0, current: emf / eq.resistance };
  walk.points.push(terminals);
  walk.atOutput.set(root.id, terminals);
  // Depth-first from the bank in file order (the points in the order a recursive walk gives),
  // without recursion: a run may be thousands of cables long.
  const stack: { child: Element; from: string; rTo: number }[] = [];
  const pushChildren = (id: string, rTo: number) => {
    const list = kids.get(id) ?? [];
    for (let k = list.length - 1; k >= 0; k--) stack.push({ child: list[k]!, from: id, rTo });
  };
  pushChildren(root.id, eq.resistance);
  while (stack.length) {
    const { child, from, rTo } = stack.pop()!;
    if (child.kind === 'cable') {
      const z = cableZ(child, 'dc', res.get(child.id)?.conductor);
      const r = rTo + z.r;
      const p: FaultPoint = { elementId: child.id, location: 'far end', portKind: 'dc', voltage: emf, impedance: r, r, x: 0, current: emf / r };
      walk.points.push(p);
      walk.atOutput.set(child.id, p);
      pushChildren(child.id, r);
    } else if (child.kind === 'dc-bus') {
      walk.atOutput.set(child.id, walk.atOutput.get(from)!);
      pushChildren(child.id, rTo);
    }
  }
  return { ok: true, walk };
}

/** AC fault study from a grid or generator through cables and transformers. */
export function acFaults(project: Project, result: SolveResult): { walk: Walk; voltageFactor: number | null } {
  const root = project.elements.find((e) => e.kind === 'grid' || e.kind === 'generator') as AcSource | undefined;
  const walk: Walk = { points: [], atOutput: new Map() };
  if (!root) return { walk, voltageFactor: null };
  const tolerance = root.voltageTolerancePercent ?? 10;
  const kind: 'ac1' | 'ac3' = root.phases === 3 ? 'ac3' : 'ac1';
  const cRoot = voltageFactor(root.voltage, tolerance);
  let zs: { r: number; x: number };
  let sourceNote: string;
  if (root.kind === 'grid' && root.shortCircuitPower !== undefined) {
    const q = feederImpedance(root)!;
    zs = { r: q.r, x: q.x };
    sourceNote = `feeder Z_Q = c·U²/S″kQ with R/X ${q.rToX}`;
  } else if (root.kind === 'generator' && root.subtransientReactancePercent !== undefined && root.ratedApparentPower !== undefined) {
    zs = { r: root.resistance ?? 0, x: ((root.subtransientReactancePercent / 100) * root.voltage * root.voltage) / root.ratedApparentPower };
    sourceNote = 'generator X″d on its rating';
  } else {
    zs = { r: root.resistance ?? 0, x: root.reactance ?? 0 };
    sourceNote = 'source R + jX as entered';
  }
  const res = new Map(result.elements.map((e) => [e.id, e]));
  const kids = childrenOf(project.elements);
  const point = (elementId: string, location: FaultPoint['location'], u: number, z: { r: number; x: number }, c: number, note?: string): FaultPoint => {
    const mag = Math.hypot(z.r, z.x);
    const current = mag > 0 ? (c * u) / ((kind === 'ac3' ? SQRT3 : 1) * mag) : null;
    const why = mag > 0 ? note : `no impedance between the source and this point (a stiff source): ${root.kind === 'generator' ? 'give the generator’s subtransient reactance X″d (the transient X′d would understate the first cycles’ current) and its rating' : 'give the supply’s short-circuit power or its resistance and reactance'}`;
    return { elementId, location, portKind: kind, voltage: u, impedance: mag, r: z.r, x: z.x, current, ...(why ? { note: why } : {}) };
  };
  const at0 = point(root.id, 'source terminals', root.voltage, zs, cRoot, sourceNote);
  walk.points.push(at0);
  walk.atOutput.set(root.id, at0);
  // Depth-first from the source in file order (the points in the order a recursive walk gives),
  // without recursion: a run may be thousands of cables long.
  type Here = { u: number; z: { r: number; x: number } | null; why: string | undefined };
  const stack: { child: Element; here: Here }[] = [];
  const pushChildren = (id: string, here: Here) => {
    const list = kids.get(id) ?? [];
    for (let k = list.length - 1; k >= 0; k--) stack.push({ child: list[k]!, here });
  };
  pushChildren(root.id, { u: root.voltage, z: zs, why: undefined });
  while (stack.length) {
    const { child, here } = stack.pop()!;
    const { u, z, why } = here;
    if (child.kind === 'cable') {
      const cz = cableZ(child, kind, res.get(child.id)?.conductor);
      const nz = z && { r: z.r + cz.r, x: z.x + cz.x };
      const p = nz ? point(child.id, 'far end', u, nz, voltageFactor(u, tolerance)) : { elementId: child.id, location: 'far end' as const, portKind: kind, voltage: u, impedance: 0, r: 0, x: 0, current: null, note: why! };
      walk.points.push(p);
      walk.atOutput.set(child.id, p);
      pushChildren(child.id, { u, z: nz, why });
    } else if (child.kind === 'transformer') {
      const t = child as TransformerStage;
      const u2 = t.secondaryVoltage;
      let nz: { r: number; x: number } | null = null;
      let nwhy = why;
      if (t.impedancePercent === undefined) {
        nwhy = `transformer "${t.name ?? t.id}" has no impedance (u_k %): its short-circuit impedance limits the fault current; enter u_k from its nameplate`;
      } else if (z) {
        const ratio2 = (u2 / t.primaryVoltage) ** 2;
        const zBase = (u2 * u2) / t.ratedApparentPower;
        const zT = (t.impedancePercent / 100) * zBase;
        const rT = (t.loadLoss / t.ratedApparentPower) * zBase;
        const xT = Math.sqrt(Math.max(0, zT * zT - rT * rT));
        const cMax = voltageFactor(u2, tolerance);
        const kT = (KT_NUMERATOR * cMax) / (1 + KT_XT_COEFFICIENT * (xT / zBase));
        nz = { r: z.r * ratio2 + kT * rT, x: z.x * ratio2 + kT * xT };
      }
      const p = nz ? point(t.id, 'secondary terminals', u2, nz, voltageFactor(u2, tolerance)) : { elementId: t.id, location: 'secondary terminals' as const, portKind: kind, voltage: u2, impedance: 0, r: 0, x: 0, current: null, note: nwhy! };
      walk.points.push(p);
      walk.atOutput.set(t.id, p);
      pushChildren(t.id, { u: u2, z: nz, why: nwhy });
    }
  }
  return { walk, voltageFactor: cRoot };
}

const kA = (a: number): string => `${(a / 1000).toPrecision(3)} kA`;

/** Each protective device against the prospective current it must interrupt. */
export function deviceChecks(project: Project, atOutput: ReadonlyMap<string, FaultPoint>): DeviceCheck[] {
  const byId = new Map(project.elements.map((e) => [e.id, e]));
  const out: DeviceCheck[] = [];
  const judge = (elementId: string, field: string, location: string, rating: number, p: FaultPoint | undefined, unknownWhy: string): DeviceCheck => {
    const i = p?.current ?? null;
    const label = field.startsWith('bankFuse') ? 'bank fuse' : 'protective device';
    if (i === null) return { elementId, field, label, location, interruptingRating: rating, prospectiveCurrent: null, status: 'unknown', message: p?.note ?? unknownWhy };
    if (i > rating) {
      return { elementId, field, label, location, interruptingRating: rating, prospectiveCurrent: i, status: 'too-weak', requiredRating: i, message: `interrupting rating ${kA(rating)} is below the prospective ${kA(i)}: fit a device rated to interrupt at least ${kA(i)}${p!.portKind === 'dc' ? ' DC' : ''}` };
    }
    return { elementId, field, label, location, interruptingRating: rating, prospectiveCurrent: i, status: 'adequate', message: `interrupting rating ${kA(rating)} covers the prospective ${kA(i)}` };
  };
  for (const e of project.elements) {
    if (e.kind === 'battery' && e.bankFuse) out.push(judge(e.id, 'bankFuse.interruptingRating', 'bank terminals', e.bankFuse.interruptingRating, atOutput.get(e.id), 'no bank fault current'));
    if (e.kind === 'cable' && e.protection) {
      const feeder = byId.get(e.from);
      out.push(
        judge(e.id, 'protection.interruptingRating', `sending end (fed by "${e.from}")`, e.protection.interruptingRating, atOutput.get(e.from), `fed by "${e.from}" (${feeder?.kind ?? 'unknown'}): the fault current there is limited by that converter; take it from the maker’s data`),
      );
    }
  }
  return out;
}

export type { SurgeStudyResult };
