/**
 * The file format, part 5: the loads at the leaves (constant power, apparent power, current, shaft,
 * circuit network, pump, fan).
 */
import type { CircuitNetwork } from './circuit-network.ts';
import type { FedElement, PfSense } from './element-base.ts';


/** Constant-power DC load, W. */
export interface DcLoad extends FedElement {
  kind: 'dc-load';
  power: number;
}

/** Constant-power AC load given by real power and power factor. */
export interface AcPowerLoad extends FedElement {
  kind: 'ac-load';
  power: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/** Constant-power AC load given by apparent power and power factor. */
export interface AcApparentLoad extends FedElement {
  kind: 'ac-va-load';
  apparentPower: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/**
 * Constant-CURRENT DC load, A: its current stays as given when the voltage sags, so it draws
 * P = V·I at whatever voltage the solve finds (a battery charger in current limit, an LED driver,
 * a heater element behind a current regulator, a load given on its label by its current).
 */
export interface DcCurrentLoad extends FedElement {
  kind: 'dc-current-load';
  /** Current drawn, A. */
  current: number;
}

/**
 * Constant-CURRENT AC load given by its rms line current and power factor: the current (and its
 * angle to the voltage) stays as given when the voltage sags, so it draws S = V·I* per phase
 * (S = V·I on single-phase, √3·V_LL·I on three-phase) at the solved voltage.
 */
export interface AcCurrentLoad extends FedElement {
  kind: 'ac-current-load';
  /** Rms line current, A. */
  current: number;
  powerFactor: number;
  pfSense?: PfSense;
}

/** Mechanical load on a motor shaft, W. */
export interface ShaftLoad extends FedElement {
  kind: 'shaft-load';
  power: number;
}

/**
 * AC load given by its circuit elements: a network of resistors, inductors and capacitors in series
 * and parallel (`CircuitNetwork` below, read by core/physics/network.ts; values in Ω, H, F as numbers, or text with
 * an SI prefix such as "4.7 mH", "220 µF", "1.2 kΩ", "10k"), evaluated at the frequency of the
 * interface feeding it. A constant-IMPEDANCE load: its power follows the square of its voltage.
 * Example: `{ "kind": "network-load", "from": "cab", "connection": "delta",
 *   "network": { "series": [ { "resistor": "12 Ω" }, { "inductor": "40 mH" } ] } }`.
 */
export interface NetworkLoad extends FedElement {
  kind: 'network-load';
  network: CircuitNetwork;
  /**
   * Three-phase only: the network is one phase of a balanced star (between line and star point;
   * the default) or one branch of a balanced delta (between two lines). Not given on single-phase,
   * where the network sits across the supply.
   */
  connection?: 'star' | 'delta';
}

/**
 * A centrifugal pump (or fan) on a motor shaft (core/kinds/pump.ts). Quadratic pump curve through
 * the shut-off head and the rated point; system curve H_s + k·Q² through the rated point; constant
 * pump efficiency (the affinity laws' assumption). Shaft power ρ·g·Q·H/η at the operating point:
 * - "speed": a drive upstream sets the speed; the pump runs on the system curve (affinity laws);
 * - "throttle": full speed, a valve takes up the difference; the pump runs on its own curve.
 */
/** A pump's curve at full speed and its efficiency (the quadratic curve through shut-off and rated point). */
export interface PumpCurve {
  /** Flow at the rated (design) point at full speed, m³/s. */
  ratedFlow: number;
  /** Head at the rated point, m. */
  ratedHead: number;
  /** Head at zero flow at full speed, m (above ratedHead). */
  shutoffHead: number;
  /** Pump efficiency, 0…1, constant over the operating range (the affinity laws' assumption). */
  efficiency: number;
  /** Fluid density, kg/m³ (default 1000, water). */
  density?: number;
}

export interface PumpLoad extends FedElement, PumpCurve {
  kind: 'pump';
  /** Static head of the system, m (0 ≤ staticHead < ratedHead). */
  staticHead: number;
  /** Operating flow, m³/s (0 < flow ≤ ratedFlow; above rated would need overspeed and is refused). */
  flow: number;
  control: 'speed' | 'throttle';
}

/**
 * A fan on a motor shaft (core/kinds/fan.ts): quadratic fan curve (pressure against flow) through
 * the shut-off pressure and the rated point, as the maker gives it at standard air (1.2 kg/m³);
 * no static head: the system's pressure is k·Q², through the rated point. Shaft power Q·Δp/η at
 * the operating point, Δp scaled by ρ/1.2 for air of another density (fan laws):
 * - "speed": a drive upstream sets the speed; affinity laws on the system curve (power ∝ speed³);
 * - "damper": full speed, an outlet damper takes up the difference; the fan rides its own curve.
 */
export interface FanLoad extends FedElement {
  kind: 'fan';
  /** Flow at the rated (design) point at full speed, m³/s. */
  ratedFlow: number;
  /** Fan pressure at the rated point, Pa (at standard air, 1.2 kg/m³). */
  ratedPressure: number;
  /** Fan pressure at zero flow at full speed, Pa (above ratedPressure). */
  shutoffPressure: number;
  /** Fan efficiency, 0…1, constant over the operating range (the affinity laws' assumption). */
  efficiency: number;
  /** Density of the air at the fan, kg/m³ (default 1.2, standard air). */
  density?: number;
  /** Operating flow, m³/s (0 < flow ≤ ratedFlow). */
  flow: number;
  control: 'speed' | 'damper';
}

export type Load = DcLoad | AcPowerLoad | AcApparentLoad | DcCurrentLoad | AcCurrentLoad | ShaftLoad | NetworkLoad | PumpLoad | FanLoad;
