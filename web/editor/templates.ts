/**
 * Default elements for the chain editor: what a new element of each kind starts as, given the port
 * that will feed it, and the sources a new project can start from.
 *
 * Every value here is a demo default, common practice (no source): a starting point the user edits
 * in the stage form, not a recommendation. Each template is checked by tests/web/templates.test.ts:
 * added after a sensible feeder, the chain solves; where it would not, it is not offered.
 *
 * The ports used to choose a template are NOMINAL (set-points and ratings read from the elements:
 * a transformer's secondary voltage, an inverter's output voltage), not solved values: each kind's
 * `nominalOutput` trait from the engine's registry (core/kinds/), the same one the conductor sizing
 * reads; nothing here computes an engineering result. The pump template's flow is chosen with the engine's own
 * shaft-power function (core/physics/pump-fan.ts).
 *
 * Defaults taken from the chain: a motor's rated voltage from the nominal voltage of the port that
 * feeds it (motorRatedVoltage: NEC/NEMA motor voltages in North American projects, the system voltage
 * for IEC); a drive offered in front of motors is rated for them (offeredTemplates: the next listed
 * drive rating up from their rated output); a motor offered behind a drive stays within its rating.
 * A drive the user set is never changed here: the engine warns when it is smaller than its motors.
 */
import { type DriveStage, driveRatedPower, type ElementKind, fanAsPumpCurve, KINDS, type NominalPort, type PortKind, pumpShaftPower, WATTS_PER_HP } from '../../core/page.ts';
import type { DraftElement, DraftProject } from '../state/editor.ts';

/** A port as the templates see it: its kind and, when known, nominal voltage (line-to-line on 3φ) and frequency. */
export type FeedingPort = NominalPort;

/** Where a new element will go: the port that feeds it, the project (for its conventions) and the feeder. */
export interface TemplateContext {
  port: FeedingPort;
  project?: DraftProject;
  feeder?: DraftElement;
}

/** Every kind that can be added to a chain (sources start a project instead). */
export const ADDABLE_KINDS: readonly ElementKind[] = [...KINDS.values()].filter((k) => k.role !== 'source').map((k) => k.kind);

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** US customary voltages on AC sources (common practice (no source)). */
const US_VOLTAGES = new Set([120, 208, 240, 277, 480, 600]);

/**
 * Does the project follow North American practice (conductors from the NEC tables, 60 Hz,
 * US service voltages)? Decides NEC vs IEC conductors and 60 vs 50 Hz for new stages.
 */
export function followsUsPractice(project: DraftProject | undefined): boolean {
  if (!project) return false;
  for (const e of project.elements) {
    const conductor = e['conductor'] as Record<string, unknown> | undefined;
    if (conductor && (conductor['system'] === 'nec' || /AWG|kcmil/i.test(String(conductor['size'] ?? '')))) return true;
    if (conductor && conductor['system'] === 'iec') return false;
  }
  const source = acSourcePort(project);
  if (source) return source.frequency === 60 || US_VOLTAGES.has(source.voltage ?? 0);
  return project.elements.some((e) => e.kind === 'inverter' && num(e['frequency']) === 60);
}

/**
 * The nominal output port of the project's AC source (the first element of a source kind whose
 * `nominalOutput` is AC), if it has one. The inverter's frequency is read by kind beside it: the
 * mains an inverter makes, where a drive's or converter's output frequency is a setting of its own.
 */
function acSourcePort(project: DraftProject | undefined): FeedingPort | undefined {
  for (const e of project?.elements ?? []) {
    if (KINDS.get(e.kind as ElementKind)?.role !== 'source') continue;
    const port = nominalOutput(e, null);
    if (port && (port.kind === 'ac1' || port.kind === 'ac3')) return port;
  }
  return undefined;
}

/** The mains frequency of the project: its AC source's, else its first inverter's, else 60 Hz for US practice and 50 Hz otherwise. */
export function projectFrequency(project: DraftProject | undefined): 50 | 60 {
  const f = acSourcePort(project)?.frequency ?? num(project?.elements.find((e) => e.kind === 'inverter')?.['frequency']);
  if (f === 50 || f === 60) return f;
  return followsUsPractice(project) ? 60 : 50;
}

/**
 * The nominal output port of an element fed at `input` (null for loads and for kinds or data it
 * cannot read): its kind's `nominalOutput` trait, read from the element's own set-points — what the
 * element is meant to give. A draft may hold anything: a trait that cannot read it gives null.
 */
export function nominalOutput(e: DraftElement, input: FeedingPort | null): FeedingPort | null {
  const spec = KINDS.get(e.kind as ElementKind);
  try {
    return spec?.nominalOutput?.(e as never, input) ?? null;
  } catch {
    return null;
  }
}

/** The nominal output port of every element of the project, walking from its source (loops and orphans are left out). */
export function nominalPorts(project: DraftProject): Map<string, FeedingPort> {
  const out = new Map<string, FeedingPort>();
  const inputs = new Map<string, FeedingPort | null>();
  const root = project.elements.find((e) => e.from === undefined);
  if (!root) return out;
  const seen = new Set<string>();
  const walk = (e: DraftElement, input: FeedingPort | null) => {
    if (seen.has(e.id)) return;
    seen.add(e.id);
    inputs.set(e.id, input);
    const port = nominalOutput(e, input);
    if (!port) return;
    out.set(e.id, port);
    for (const child of project.elements) if (child.from === e.id) walk(child, port);
  };
  walk(root, null);
  return out;
}

/**
 * A motor's rated voltage on a port of nominal (system) voltage `system`. North American motors are
 * rated at the utilization voltage, a little below the system's nominal voltage: the voltages of
 * NEC Table 430.250 (3φ) and 430.248 (1φ) and NEMA MG 1 (motors on a 480 V system are rated 460 V,
 * on 208 V 200 V, on 240 V 230 V, on 600 V 575 V, on 120 V 115 V). IEC motors are rated at the
 * system voltage (IEC 60038: 230/400 V). Voltages outside the map are kept as they are.
 */
const NEC_MOTOR_VOLTAGE: ReadonlyMap<number, number> = new Map([
  [120, 115],
  [208, 200],
  [240, 230],
  [480, 460],
  [600, 575],
]);

/** The rated voltage a motor fed at `port` is given (undefined when the port's voltage is not known). */
export function motorRatedVoltage(port: FeedingPort, us: boolean): number | undefined {
  if (port.voltage === undefined) return undefined;
  return us ? (NEC_MOTOR_VOLTAGE.get(port.voltage) ?? port.voltage) : port.voltage;
}

/**
 * Common drive (and motor) ratings, W: the IEC motor rating series 0.37 … 355 kW that drive makers
 * list their frames by (common practice (no source)).
 */
export const DRIVE_RATINGS: readonly number[] = [
  370, 550, 750, 1100, 1500, 2200, 3000, 4000, 5500, 7500, 11000, 15000, 18500, 22000, 30000, 37000, 45000, 55000, 75000, 90000, 110000, 132000,
  160000, 200000, 250000, 315000, 355000,
];

/** NEMA MG 1 standard motor ratings, hp (1 … 300 hp), for 60 Hz motors (from memory: MG 1 Part 10 rating series). */
const NEMA_HP: readonly number[] = [1, 1.5, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300];

/** The largest standard motor rating, W, at or below `power` W: NEMA hp on 60 Hz, the IEC kW series otherwise. */
function motorRatingWithin(power: number, f: 50 | 60): number {
  const series = f === 60 ? NEMA_HP.map((hp) => Number((hp * WATTS_PER_HP).toFixed(1))) : DRIVE_RATINGS;
  return [...series].reverse().find((r) => r <= power * (1 + 1e-9)) ?? power;
}

/** The smallest listed drive rating at or above `power` W; above the list, `power` itself rounded up to a kilowatt. */
export function driveRatingFor(power: number): number {
  return DRIVE_RATINGS.find((r) => r >= power * (1 - 1e-9)) ?? Math.ceil(power / 1000) * 1000;
}

/**
 * The rated power of a drive element, if given: the drive kind's own reading (its loss model's rated
 * power, or its IEC 61800-9-2 rated apparent power; core/kinds/drive.ts), the one the engine's
 * undersized-drive warning uses, kept only when the draft holds a finite number there.
 */
export function driveRating(e: DraftElement | undefined): number | undefined {
  if (e?.kind !== 'drive') return undefined;
  return num(driveRatedPower(e as unknown as DriveStage));
}

/**
 * The total rated output of the motors `e` feeds, looking through pass-through stages (cables, buses)
 * to the first motors below: what a drive put in front of `e` must carry. Undefined when none.
 */
function motorsFed(project: DraftProject, fed: readonly DraftElement[]): number | undefined {
  let total: number | undefined;
  const seen = new Set<string>();
  const walk = (e: DraftElement) => {
    if (seen.has(e.id)) return;
    seen.add(e.id);
    if (e.kind === 'motor') {
      const r = num(e['ratedOutput']);
      if (r !== undefined) total = (total ?? 0) + r;
      return;
    }
    if (!KINDS.get(e.kind as ElementKind)?.passive) return;
    for (const child of project.elements) if (child.from === e.id) walk(child);
  };
  for (const e of fed) walk(e);
  return total;
}

/** A drive template rated for motors of `motors` W in all: the next listed rating up, never smaller than the motors. */
function driveSizedFor(element: DraftElement, motors: number): DraftElement {
  const rated = driveRatingFor(motors);
  const loss = element['loss'] as Record<string, unknown> | undefined;
  if (!loss || (num(loss['ratedPower']) ?? 0) >= rated) return element;
  return { ...element, loss: { ...loss, ratedPower: rated } };
}

/** Round to a tidy number of watts for a default (two significant figures). */
const tidy = (w: number) => Number(w.toPrecision(2));

/** The rated output of a motor feeding a shaft port, if it can be read. */
function motorRating(feeder: DraftElement | undefined): number | undefined {
  return feeder?.kind === 'motor' ? num(feeder['ratedOutput']) : undefined;
}

/** A shaft load that a motor of this rating carries comfortably: 70 % of rated, at most 5 kW. */
function shaftPowerFor(feeder: DraftElement | undefined): number {
  const rated = motorRating(feeder);
  return rated === undefined ? 5000 : tidy(Math.min(5000, 0.7 * rated));
}

function cableTemplate(project: DraftProject | undefined): DraftElement {
  const conductor = followsUsPractice(project)
    ? { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 }
    : { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' };
  return { id: 'cable', kind: 'cable', length: 10, conductor };
}

const constantLoss = (efficiency: number, ratedPower?: number) => ({ model: 'constant', efficiency, ...(ratedPower !== undefined ? { ratedPower } : {}) });

/** Pump curve defaults: 30 m rated head, 38 m shut-off, 75 % efficiency, 8 m static head (common practice (no source)). */
const PUMP = { ratedHead: 30, shutoffHead: 38, efficiency: 0.75, staticHead: 8 } as const;
const PUMP_FLOWS = [0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1] as const;

function pumpTemplate(feeder: DraftElement | undefined): DraftElement {
  const budget = motorRating(feeder) === undefined ? 5000 : 0.8 * motorRating(feeder)!;
  // The largest listed rated flow whose shaft power at the rated point fits the motor (engine's formula).
  const ratedFlow =
    [...PUMP_FLOWS].reverse().find((q) => pumpShaftPower({ ...PUMP, ratedFlow: q }, q, PUMP.ratedHead) <= budget) ?? PUMP_FLOWS[0];
  return { id: 'pump', kind: 'pump', ...PUMP, ratedFlow, flow: Number((0.9 * ratedFlow).toPrecision(3)), control: 'throttle' };
}

/** Fan curve defaults: 1000 Pa rated, 1300 Pa shut-off, 70 % efficiency (common practice (no source)). */
const FAN = { ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7 } as const;
const FAN_FLOWS = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20] as const;

function fanTemplate(feeder: DraftElement | undefined): DraftElement {
  const budget = motorRating(feeder) === undefined ? 5000 : 0.8 * motorRating(feeder)!;
  // The largest listed rated flow whose shaft power at the rated point fits the motor (engine's formula).
  const fits = (q: number) => {
    const curve = fanAsPumpCurve({ ...FAN, ratedFlow: q });
    return pumpShaftPower(curve, q, curve.ratedHead) <= budget;
  };
  const ratedFlow = [...FAN_FLOWS].reverse().find(fits) ?? FAN_FLOWS[0];
  return { id: 'fan', kind: 'fan', ...FAN, ratedFlow, flow: Number((0.8 * ratedFlow).toPrecision(3)), control: 'damper' };
}

/**
 * The default element of `kind` for a new element fed at `ctx.port`, or null when the kind cannot
 * take that port (or has no sensible default there). Ids are bases: the editor makes them unique.
 */
export function templateFor(kind: ElementKind, ctx: TemplateContext): DraftElement | null {
  const { port, project, feeder } = ctx;
  const ac = port.kind === 'ac1' || port.kind === 'ac3';
  const f = port.frequency === 50 || port.frequency === 60 ? port.frequency : projectFrequency(project);
  const us = followsUsPractice(project) || f === 60;
  let t: DraftElement | null = null;
  switch (kind) {
    case 'inverter':
      if (port.kind === 'dc') {
        const mains = projectFrequency(project);
        t = { id: 'inverter', kind, phases: 1, outputVoltage: mains === 60 ? 120 : 230, frequency: mains, loss: constantLoss(0.95) };
      }
      break;
    case 'dc-dc':
      if (port.kind === 'dc') t = { id: 'dc-dc', kind, outputVoltage: (port.voltage ?? 48) <= 14 ? 24 : 12, loss: constantLoss(0.94) };
      break;
    case 'dc-bus':
      if (port.kind === 'dc') t = { id: 'dc-bus', kind, fixedLoss: 5 };
      break;
    case 'transfer-switch':
      // A transfer switch on any electrical port: 0.5 mΩ per pole, 15 W of control power, 4 ms transfer
      // (typical values from memory; the form says to use the maker's figures).
      if (port.kind !== 'shaft') t = { id: 'transfer-switch', kind, contactResistance: 0.0005, controlPower: 15, transferTime: 0.004 };
      break;
    case 'rectifier':
      if (ac) t = { id: 'charger', kind, outputVoltage: 48, inputPowerFactor: 0.95, loss: constantLoss(0.92) };
      break;
    case 'transformer':
      if (ac) {
        const primary = port.voltage ?? (port.kind === 'ac3' ? (us ? 480 : 400) : us ? 240 : 230);
        const secondary = us ? (port.kind === 'ac3' ? 208 : 120) : port.kind === 'ac3' ? 400 : 230;
        // A 15 kVA dry-type unit: about 0.7 % no-load and 2.3 % load loss, 4 % impedance (common practice (no source)).
        t = { id: 'transformer', kind, ratedApparentPower: 15000, primaryVoltage: primary, secondaryVoltage: secondary, noLoadLoss: 100, loadLoss: 350, impedancePercent: 4 };
      }
      break;
    case 'drive':
      if (ac) {
        const out = port.kind === 'ac3' && port.voltage !== undefined ? port.voltage : 230;
        t = { id: 'drive', kind, outputVoltage: out, outputFrequency: f, inputPowerFactor: 0.95, loss: constantLoss(0.97, 11000) };
      }
      break;
    case 'motor':
      if (ac) {
        // IE3 (IEC 60034-30-1) on 50 Hz, NEMA Premium (MG 1 Table 12-12) on 60 Hz: the presets carry 4-pole motors.
        // Phases: a motor has no phase field of its own; it runs on the port's (1φ or 3φ, the preset's size follows it).
        const three = port.kind === 'ac3';
        let ratedOutput = f === 60 ? (three ? 7457 : 1491) : three ? 7500 : 2200; // 10 hp / 2 hp; 7.5 kW / 2.2 kW
        // Behind a drive the motor stays within the drive's rating (the user's drive is never changed here).
        const drive = driveRating(feeder);
        if (drive !== undefined && ratedOutput > drive) ratedOutput = motorRatingWithin(drive, f);
        // Rated voltage from the port that feeds it (a drive's output follows its supply's voltage class).
        const ratedVoltage = motorRatedVoltage(port, us);
        t = { id: 'motor', kind, ratedOutput, ...(ratedVoltage !== undefined ? { ratedVoltage } : {}), efficiencyClass: f === 60 ? 'NEMA-premium' : 'IE3', poles: 4, ratedFrequency: f };
      }
      break;
    case 'cable':
      if (port.kind !== 'shaft') t = cableTemplate(project);
      break;
    case 'generic':
      if (port.kind !== 'shaft') {
        t = {
          id: 'converter',
          kind,
          inputKind: port.kind,
          outputKind: 'dc',
          outputVoltage: 24,
          ...(ac ? { inputPowerFactor: 0.95 } : {}),
          loss: constantLoss(0.93),
        };
      }
      break;
    case 'dc-load':
      if (port.kind === 'dc') t = { id: 'dc-load', kind, power: 100 };
      break;
    case 'ac-load':
      if (ac) t = { id: 'load', kind, power: 500, powerFactor: 0.9 };
      break;
    case 'ac-va-load':
      if (ac) t = { id: 'load', kind, apparentPower: 1000, powerFactor: 0.8 };
      break;
    case 'dc-current-load':
      // A few amperes: a small DC load given by its label current (a planning example to replace).
      if (port.kind === 'dc') t = { id: 'dc-load', kind, current: 2 };
      break;
    case 'ac-current-load':
      if (ac) t = { id: 'load', kind, current: 4, powerFactor: 0.9 };
      break;
    case 'network-load':
      if (ac) t = { id: 'rl-load', kind, network: { series: [{ resistor: '50 Ω' }, { inductor: '50 mH' }] } };
      break;
    case 'shaft-load':
      if (port.kind === 'shaft') t = { id: 'shaft-load', kind, power: shaftPowerFor(feeder) };
      break;
    case 'pump':
      if (port.kind === 'shaft') t = pumpTemplate(feeder);
      break;
    case 'fan':
      if (port.kind === 'shaft') t = fanTemplate(feeder);
      break;
    default:
      t = null;
  }
  if (!t) return null;
  // The engine's own word on the port kinds this element accepts.
  const spec = KINDS.get(kind);
  return spec && spec.role !== 'source' && spec.accepts(t as never).includes(port.kind) ? t : null;
}

/** The kinds offered after a port, with their templates, in the registry's order. */
export function templatesAfter(ctx: TemplateContext): { kind: ElementKind; element: DraftElement }[] {
  const out: { kind: ElementKind; element: DraftElement }[] = [];
  for (const kind of ADDABLE_KINDS) {
    const element = templateFor(kind, ctx);
    if (element) out.push({ kind, element });
  }
  return out;
}

/** Does `element` accept a port of this kind (the engine's accepts)? */
export function acceptsPort(element: DraftElement, kind: PortKind): boolean {
  const spec = KINDS.get(element.kind as ElementKind);
  if (!spec) return false;
  try {
    return spec.accepts(element as never).includes(kind);
  } catch {
    return false;
  }
}

/** The chain operations that add an element. */
export type AddOperation = 'after' | 'branch' | 'before';

/**
 * What can be added at `targetId` by an add operation, each with its template:
 * - "branch": fed from the target (a new branch);
 * - "after": fed from the target, feeding what the target fed (its output must suit all of them);
 * - "before": fed from the target's feeder, feeding the target.
 * Loads are offered only where nothing would be fed from them; a motor shaft that already drives a
 * load is offered no second branch.
 */
export function offeredTemplates(project: DraftProject, op: AddOperation, targetId: string): { kind: ElementKind; element: DraftElement }[] {
  const target = project.elements.find((e) => e.id === targetId);
  if (!target) return [];
  const ports = nominalPorts(project);
  const feederId = op === 'before' ? target.from : target.id;
  if (feederId === undefined) return [];
  const feeder = project.elements.find((e) => e.id === feederId);
  const port = ports.get(feederId);
  if (!port || !feeder) return [];
  // A bank on a bus (a source kind fed from a bus, core/solve/modes.ts) is a load there: it feeds nothing.
  if (isBankOnBus(feeder)) return [];
  // A shaft drives one load here: a second one would share a motor sized for the first.
  if (op === 'branch' && port.kind === 'shaft' && project.elements.some((e) => e.from === feederId)) return [];
  const fed = op === 'after' ? project.elements.filter((e) => e.from === target.id) : op === 'before' ? [target] : [];
  // A drive put in front of motors is rated for them.
  const motors = motorsFed(project, fed);
  const offered = templatesAfter({ port, project, feeder }).map((o) =>
    o.kind === 'drive' && motors !== undefined ? { ...o, element: driveSizedFor(o.element, motors) } : o,
  );
  return offered.filter(({ kind, element }) => {
    if (fed.length === 0) return true;
    if (KINDS.get(kind)!.role === 'load') return false;
    // A bank on a bus hangs on a DC bus through cables only: in front of it, only a cable or a bus.
    if (kind !== 'cable' && kind !== 'dc-bus' && fed.some((child) => reachesBankOnBus(project, child))) return false;
    // The new element's output must suit everything downstream of it, through pass-through stages (cables, buses).
    const out = nominalOutput(element, port);
    return out !== null && fed.every((child) => subtreeFits(project, child, out));
  });
}

/** A source kind fed from a bus (the engine's `fedRole` trait): a bank on a bus. */
const isBankOnBus = (e: DraftElement): boolean => e.from !== undefined && KINDS.get(e.kind as ElementKind)?.fedRole !== undefined;

/** Is `e` a bank on a bus, or a cable leading (through cables only) to one? */
function reachesBankOnBus(project: DraftProject, e: DraftElement, seen = new Set<string>()): boolean {
  if (seen.has(e.id)) return false;
  seen.add(e.id);
  if (isBankOnBus(e)) return true;
  return e.kind === 'cable' && project.elements.some((c) => c.from === e.id && reachesBankOnBus(project, c, seen));
}

/** Does every element from `e` down accept the port it would be fed at, starting with `input` at `e`? */
function subtreeFits(project: DraftProject, e: DraftElement, input: FeedingPort, seen = new Set<string>()): boolean {
  if (seen.has(e.id)) return true;
  seen.add(e.id);
  if (!acceptsPort(e, input.kind)) return false;
  const children = project.elements.filter((c) => c.from === e.id);
  if (children.length === 0) return true;
  const out = nominalOutput(e, input);
  return out !== null && children.every((c) => subtreeFits(project, c, out, seen));
}

/** A source a new project can start from. */
export interface SourceTemplate {
  key: string;
  label: string;
  element: DraftElement;
}

/** Sources for a new project (demo defaults, common practice (no source)). */
export const SOURCE_TEMPLATES: readonly SourceTemplate[] = [
  { key: 'grid-3-400', label: 'Utility supply, 3φ 400 V 50 Hz', element: { id: 'supply', name: '400 V supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 } },
  { key: 'grid-1-230', label: 'Utility supply, 1φ 230 V 50 Hz', element: { id: 'supply', name: '230 V supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 } },
  {
    key: 'grid-1-240-60',
    // Split-phase 120/240 V is modelled across the two lines (240 V); 120 V loads go behind a transformer or as their share.
    label: 'Utility supply, 1φ 120/240 V 60 Hz',
    element: { id: 'supply', name: '120/240 V service', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
  },
  { key: 'grid-3-480-60', label: 'Utility supply, 3φ 480 V 60 Hz', element: { id: 'supply', name: '480 V service', kind: 'grid', phases: 3, voltage: 480, frequency: 60 } },
  {
    key: 'generator',
    label: 'Generator, 3φ 400 V 50 Hz, 20 kVA',
    element: { id: 'generator', name: '20 kVA generator', kind: 'generator', phases: 3, voltage: 400, frequency: 50, resistance: 0.05, reactance: 0.4, ratedApparentPower: 20000 },
  },
  {
    key: 'battery-48',
    label: 'Battery bank, 48 V LiFePO4 (16 × 100 Ah)',
    element: { id: 'bank', name: '48 V LiFePO4 bank', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 1, capacityAh: 100 } },
  },
];

/**
 * A bank on a bus (issue 19): offered on a DC bus card of a chain fed from a supply, while the project
 * holds no bank on a bus yet (a project holds one, core/solve/structure.ts). The preset: VRLA AGM 12 V
 * 100 Ah blocks (6 cells each), as many in series as make the bus's voltage the float voltage, at
 * 2.27 V per cell (VRLA float, 2.25–2.30 V per cell at 25 °C: common practice (no source); the maker's
 * figure governs); one string. Null when the card is no DC bus, the bus's voltage is unknown, or a bank
 * already sits on a bus.
 */
export function bankOnBusTemplate(project: DraftProject, busId: string): DraftElement | null {
  const bus = project.elements.find((e) => e.id === busId);
  if (!bus || bus.kind !== 'dc-bus') return null;
  const root = project.elements.find((e) => e.from === undefined);
  if (!root || root.kind === 'battery') return null;
  if (project.elements.some((e) => isBankOnBus(e))) return null;
  const v = nominalPorts(project).get(busId)?.voltage;
  if (v === undefined || !(v > 0)) return null;
  const series = Math.max(1, Math.round(v / (6 * 2.27)));
  return {
    id: 'bank',
    name: `Battery bank, ${series} × 12 V 100 Ah`,
    kind: 'battery',
    bank: { chemistry: 'vrla-agm', series, cellsPerBlock: 6, strings: 1, capacityAh: 100 },
  };
}
