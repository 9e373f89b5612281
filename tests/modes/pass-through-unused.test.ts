/**
 * A pass-through limit the modes cannot use (core/solve/bank-place.ts `unusedPassThrough`): an inverter
 * whose DC bus holds no battery bank. The field then does nothing, and the modes study says so, naming
 * the inverter by its name and the field by its form label (core/model/field-labels.ts). In a project
 * with no bank on a bus at all, no modes study runs: the solve itself warns (`pass-through-unused`,
 * core/solve/project-warnings.ts), and so does a named variant's solve, but not the on-battery mode a
 * study builds from a DC plant (the same layout as an off-grid chain). Chains invented
 * for the test; the rule is the modes' own (common practice (no source): an inverter-charger's relay
 * passes the supply through only where its charger side sits on the bank's bus).
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { outageSolve, solveModes, unusedPassThrough } from '../../core/solve/modes.ts';
import { solveProject } from '../../core/solve/index.ts';
import { solveProjectVariant } from '../../core/solve/project-variant.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { fieldLabel } from '../../core/model/field-labels.ts';
import type { Project } from '../../core/model/project.ts';

const inverter = (id: string, name: string, from: string, limit?: number) => ({
  id,
  name,
  kind: 'inverter',
  from,
  phases: 1,
  outputVoltage: 230,
  frequency: 50,
  ...(limit !== undefined ? { passThroughLimit: limit } : {}),
  loss: { model: 'constant', efficiency: 0.9, idleLoss: 20 },
});

/** Supply → two chargers, each onto its own DC bus; the bank sits on bus A only; "Workshop inverter" on bus B has a limit. */
const twoBuses = (limitOnB: number | undefined) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Two buses',
  elements: [
    { id: 'grid', name: 'Shore supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect-a', name: 'Charger A', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'bus-a', name: 'Bus A', kind: 'dc-bus', from: 'rect-a', fixedLoss: 0 },
    { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus-a', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 } },
    inverter('inv-a', 'Cabin inverter', 'bus-a', 16),
    { id: 'cabin', name: 'Cabin', kind: 'ac-load', from: 'inv-a', power: 2300, powerFactor: 1 },
    { id: 'rect-b', name: 'Charger B', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'bus-b', name: 'Bus B', kind: 'dc-bus', from: 'rect-b', fixedLoss: 0 },
    inverter('inv-b', 'Workshop inverter', 'bus-b', limitOnB),
    { id: 'tools', name: 'Tools', kind: 'ac-load', from: 'inv-b', power: 1000, powerFactor: 1 },
  ],
});

const LABEL = fieldLabel('inverter', 'passThroughLimit');

/** An off-grid cabin: the bank is the source, its bus feeds an inverter (with a limit, or none). */
const offGrid = (limit: number | undefined) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Off grid',
  elements: [
    { id: 'bank', name: 'House bank', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, capacityAh: 200 } },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'bank', fixedLoss: 0 },
    inverter('inv', 'Cabin inverter', 'bus', limit),
    { id: 'cabin', name: 'Cabin', kind: 'ac-load', from: 'inv', power: 1000, powerFactor: 1 },
  ],
});

/** The solve's warning: the element's name is shown before it (the page's list, the CLI), so it does not repeat it. */
const NO_BANK_ON_BUS = `its "Pass-through limit (inverter-charger)" is used only when a battery bank is on the inverter's DC bus; this chain has no bank on a bus, so the limit does nothing here`;

/** The solve's warnings of this code, as element id and message. */
const unusedIn = (outcome: ReturnType<typeof solveProject>) => {
  if (!outcome.ok) throw new Error(`does not solve: ${outcome.problems.map((p) => p.message).join('; ')}`);
  return outcome.result.warnings.filter((w) => w.code === 'pass-through-unused').map((w) => ({ elementId: w.elementId, message: w.message }));
};

describe('a pass-through limit on an inverter off the bank’s bus', () => {
  it('the label is the form’s', () => {
    expect(LABEL).toBe('Pass-through limit (inverter-charger)'); // core/model/field-labels.ts, the form's label
  });

  it('the modes study warns, naming the inverter and the field; the one on the bank’s bus is used and not named', () => {
    const solved = solvedOf(twoBuses(10));
    const modes = solveModes(solved)!;
    // The cabin inverter on the bank's bus passes the supply through; the workshop one is not among the places.
    expect(modes.passThrough?.places.map((p) => p.inverterId)).toEqual(['inv-a']);
    const study = runModesStudy(solved, modes);
    if (!study?.ok) throw new Error('the modes study failed');
    const named = study.study.warnings.filter((w) => w.message.includes(LABEL));
    expect(named.map((w) => w.message)).toEqual([
      `"Workshop inverter": its "Pass-through limit (inverter-charger)" is used only when a battery bank is on the inverter's DC bus; the bank of this chain is on another bus, so the limit does nothing here`,
    ]);
  });

  it('no limit on the workshop inverter: no such warning', () => {
    const study = runModesStudy(solvedOf(twoBuses(undefined)));
    if (!study?.ok) throw new Error('the modes study failed');
    expect(study.study.warnings.filter((w) => w.message.includes(LABEL))).toEqual([]);
  });

  it('a chain with no bank on a bus (the bank is the source): every limit is named', () => {
    const solved = solvedOf(offGrid(16));
    expect(solveModes(solved)).toBeNull();
    const unused = unusedPassThrough(solved.project as Project, null);
    expect(unused).toEqual([{ inverterId: 'inv', message: `"Cabin inverter": ${NO_BANK_ON_BUS}`, reason: NO_BANK_ON_BUS }]);
  });

  it('an inverter without a name is named by its kind and place, as messages name it', () => {
    const p = twoBuses(10);
    p.elements = p.elements.map((e) => (e.id === 'inv-b' ? { ...e, name: undefined } : e)) as typeof p.elements;
    const solved = solvedOf(JSON.parse(JSON.stringify(p)));
    const msg = unusedPassThrough(solved.project as Project, solveModes(solved)!.place)[0]!.message;
    expect(msg).toMatch(/^"Inverter #\d+": its "Pass-through limit \(inverter-charger\)"/);
  });

  describe('no bank on a bus at all: the solve warns', () => {
    it('an off-grid chain whose bank is the source: the solve names the inverter and the field', () => {
      expect(unusedIn(solveProject(offGrid(16)))).toEqual([{ elementId: 'inv', message: NO_BANK_ON_BUS }]);
    });

    it('the same without a limit: no warning; nothing else in the solve changes with the limit', () => {
      expect(unusedIn(solveProject(offGrid(undefined)))).toEqual([]);
      const a = solveProject(offGrid(16));
      const b = solveProject(offGrid(undefined));
      if (!a.ok || !b.ok) throw new Error('does not solve');
      // The limit does nothing: the same figures (totals), only the one warning more.
      expect(a.result.totals).toEqual(b.result.totals);
      expect(a.result.warnings.length).toBe(b.result.warnings.length + 1);
    });

    it('a chain with a supply and no bank (grid → charger → bus → inverter): the solve warns', () => {
      const noBank = twoBuses(10);
      // Take the bank out: neither bus holds one now.
      noBank.elements = noBank.elements.filter((e) => e.id !== 'bank');
      const names = unusedIn(solveProject(noBank));
      expect(names.map((w) => w.elementId)).toEqual(['inv-a', 'inv-b']);
      expect(names.map((w) => w.message)).toEqual([NO_BANK_ON_BUS, NO_BANK_ON_BUS]);
    });

    it('a project with a bank on a bus: the solve does not warn (the modes study names an inverter on another bus)', () => {
      expect(unusedIn(solveProject(twoBuses(10)))).toEqual([]);
    });

    it('the on-battery mode a study builds from a DC plant (the layout of an off-grid chain) carries no such warning', () => {
      const outage = outageSolve(solvedOf(twoBuses(10)));
      if (!outage.ok) throw new Error('the on-battery mode does not solve');
      expect(outage.onBattery).toBe(true);
      expect(outage.solved.result.warnings.filter((w) => w.code === 'pass-through-unused')).toEqual([]);
    });

    it('a named variant of the off-grid chain gets the warning, as the project does', () => {
      const solved = solvedOf(offGrid(16));
      const variant = solveProjectVariant(solved, { name: 'Bigger cabin', set: { cabin: { power: 1500 } } });
      expect(unusedIn(variant)).toEqual([{ elementId: 'inv', message: NO_BANK_ON_BUS }]);
    });
  });
});
