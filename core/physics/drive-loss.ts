/**
 * Drive losses at an operating point from the eight standard points of IEC 61800-9-2.
 *
 * Method: bilinear interpolation in (speed %, torque %) over the grid speed ∈ {0, 50, top} ×
 * torque ∈ {25, 50, 100}, top = 90 % (CDM basis) or 100 % (PDS basis). The standard gives eight of
 * the nine grid nodes; the missing node (top speed, 25 % torque) is filled by carrying the 50 %-speed
 * row's change from 50 % to 25 % torque up to the top speed:
 *   L(top,25) = L(top,50) + [L(50,25) − L(50,50)]   (our completion, no source).
 * A point outside the grid (speed above top, torque below 25 % or above 100 %) is clamped to the
 * grid's edge and flagged; a point outside 0–100 % is refused (see `checkOperatingPoint`).
 */
import type { Problem } from '../model/errors.ts';
import type { DriveStandardLoss } from '../model/project.ts';
import { IE2_CDM_DEFAULT_LOSS_PERCENT, SPEED_GRID, TORQUE_GRID, type DriveLossBasis } from '../data/iec-61800-9-2.ts';

type Issue = Omit<Problem, 'elementId'>;

/** A loss grid ready to evaluate: losses[iSpeed][iTorque] in W. */
export interface DriveLossGrid {
  basis: DriveLossBasis;
  speeds: readonly number[];
  torques: readonly number[];
  losses: readonly (readonly number[])[];
  /** Where the eight values came from. */
  source: string;
}

export interface DriveLossAt {
  /** W. */
  loss: number;
  /** The point actually used after clamping, %. */
  speed: number;
  torque: number;
  /** True when the asked point lay outside the grid and was clamped to its edge. */
  clamped: boolean;
}

/** Build the grid from the user's eight values or the IE2 class-reference defaults. */
export function driveLossGrid(spec: DriveStandardLoss): { ok: true; grid: DriveLossGrid } | { ok: false; problems: Issue[] } {
  let eight: readonly number[];
  let source: string;
  if (spec.points !== undefined) {
    if (spec.points.length !== 8) {
      return { ok: false, problems: [{ code: 'invalid-value', field: 'standardLoss.points', value: spec.points, message: `needs exactly the eight losses of IEC 61800-9-2 (W), got ${spec.points.length}` }] };
    }
    eight = spec.points;
    source = `maker's losses at the eight IEC 61800-9-2 ${spec.basis.toUpperCase()} points`;
  } else {
    if (spec.basis !== 'cdm') {
      return { ok: false, problems: [{ code: 'invalid-value', field: 'standardLoss.points', message: 'defaults exist for a drive module alone (basis "cdm"); for basis "pds" give the eight measured losses' }] };
    }
    eight = IE2_CDM_DEFAULT_LOSS_PERCENT.map((pct) => (pct / 100) * spec.ratedApparentPower);
    source = "IE2 class-reference drive losses (typical values: use the maker's figures)";
  }
  const [l0_25, l0_50, l0_100, l50_25, l50_50, l50_100, lt_50, lt_100] = eight as [number, number, number, number, number, number, number, number];
  const lt_25 = Math.max(0, lt_50 + (l50_25 - l50_50));
  return {
    ok: true,
    grid: {
      basis: spec.basis,
      speeds: SPEED_GRID[spec.basis],
      torques: TORQUE_GRID,
      losses: [
        [l0_25, l0_50, l0_100],
        [l50_25, l50_50, l50_100],
        [lt_25, lt_50, lt_100],
      ],
      source,
    },
  };
}

/** Index i with axis[i] ≤ v ≤ axis[i+1] and the fraction along it (v already clamped). */
function bracket(axis: readonly number[], v: number): [number, number] {
  let i = 0;
  while (i < axis.length - 2 && v > axis[i + 1]!) i++;
  return [i, (v - axis[i]!) / (axis[i + 1]! - axis[i]!)];
}

/** Drive loss at (speed %, torque %): bilinear over the grid, clamped at its edges (flagged). */
export function driveLossAt(grid: DriveLossGrid, speed: number, torque: number): DriveLossAt {
  const s = Math.min(Math.max(speed, grid.speeds[0]!), grid.speeds[grid.speeds.length - 1]!);
  const t = Math.min(Math.max(torque, grid.torques[0]!), grid.torques[grid.torques.length - 1]!);
  const [i, fs] = bracket(grid.speeds, s);
  const [j, ft] = bracket(grid.torques, t);
  const L = grid.losses;
  const loss =
    (1 - fs) * (1 - ft) * L[i]![j]! + (1 - fs) * ft * L[i]![j + 1]! + fs * (1 - ft) * L[i + 1]![j]! + fs * ft * L[i + 1]![j + 1]!;
  return { loss, speed: s, torque: t, clamped: s !== speed || t !== torque };
}

/** An operating point given as speed % and torque % must lie in 0–100 %. */
export function checkOperatingPoint(speed: number, torque: number, field: string): Issue[] {
  const out: Issue[] = [];
  for (const [name, v] of [['speed', speed], ['torque', torque]] as const) {
    if (!Number.isFinite(v) || v < 0 || v > 100) {
      out.push({ code: 'invalid-value', field: `${field}.${name}`, value: v, message: `the operating point's ${name} must lie in 0–100 % (got ${String(v)} %)` });
    }
  }
  return out;
}

/** True power factor with current distortion, voltage undistorted: pf = pf_disp / √(1 + THD_i²). */
export function truePowerFactor(displacement: number, thd: number): number {
  return displacement / Math.sqrt(1 + thd * thd);
}

/**
 * Drive loss at a user-given operating point: refuses a point outside 0–100 % (speed or torque)
 * and bad loss points, naming the field; otherwise the bilinear interpolation of `driveLossAt`.
 */
export function driveLossAtPoint(
  spec: DriveStandardLoss,
  point: { speed: number; torque: number },
  elementId = 'drive',
): { ok: true; result: DriveLossAt & { source: string } } | { ok: false; problems: Problem[] } {
  const g = driveLossGrid(spec);
  const issues = [...checkOperatingPoint(point.speed, point.torque, 'operatingPoint'), ...(g.ok ? [] : g.problems)];
  if (issues.length || !g.ok) return { ok: false, problems: issues.map((p) => ({ ...p, elementId })) };
  return { ok: true, result: { ...driveLossAt(g.grid, point.speed, point.torque), source: g.grid.source } };
}
