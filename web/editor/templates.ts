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
 *
 * This file is the templates' entry (every export is reachable here, as callers import it): the
 * template of each kind and what is offered where; its parts live in web/editor/templates/: `ports.ts`
 * (nominal ports, what a port suits, the project's conventions), `machines.ts` (motors, drives, shaft
 * loads, pumps and fans) and `sources.ts` (a new project's sources, the bank on a bus).
 */
import { type ElementKind, KINDS } from '../../core/page.ts';
import type { DraftElement, DraftProject } from '../state/editor.ts';
import { acceptsPort, followsUsPractice, nominalOutput, nominalPorts, projectFrequency, type FeedingPort } from './templates/ports.ts';
import { driveRating, driveSizedFor, fanTemplate, motorRatedVoltage, motorRatingWithin, motorsFed, pumpTemplate, shaftPowerFor } from './templates/machines.ts';
import { isBankOnBus } from './templates/sources.ts';

export { acceptsPort, followsUsPractice, nominalOutput, nominalPorts, projectFrequency, type FeedingPort } from './templates/ports.ts';
export { DRIVE_RATINGS, driveRating, driveRatingFor, motorRatedVoltage } from './templates/machines.ts';
export { bankOnBusTemplate, SOURCE_TEMPLATES, type SourceTemplate } from './templates/sources.ts';

/** Where a new element will go: the port that feeds it, the project (for its conventions) and the feeder. */
export interface TemplateContext {
  port: FeedingPort;
  project?: DraftProject;
  feeder?: DraftElement;
}

/** Every kind that can be added to a chain (sources start a project instead). */
export const ADDABLE_KINDS: readonly ElementKind[] = [...KINDS.values()].filter((k) => k.role !== 'source').map((k) => k.kind);

function cableTemplate(project: DraftProject | undefined): DraftElement {
  const conductor = followsUsPractice(project)
    ? { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 }
    : { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' };
  return { id: 'cable', kind: 'cable', length: 10, conductor };
}

const constantLoss = (efficiency: number, ratedPower?: number) => ({ model: 'constant', efficiency, ...(ratedPower !== undefined ? { ratedPower } : {}) });

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

