/**
 * The energy-flow graph (core/flow.ts): a hand-worked chain whose every figure follows from the
 * element parameters, and the three demo projects (conservation at every node, one loss branch per
 * source and stage, link values equal to the engine's P_in and loss).
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, flowGraph, lossNodeId, solveProject, type FlowGraph, type SolveResult } from '../../core/index.ts';
import { deepFreeze } from './arbitraries.ts';

function solved(project: unknown): SolveResult {
  const outcome = solveProject(project);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return outcome.result;
}

const link = (g: FlowGraph, source: string, target: string) => {
  const l = g.links.find((x) => x.source === source && x.target === target);
  if (!l) throw new Error(`no link ${source} → ${target}`);
  return l;
};

/** Relative closeness at the brief's 1e-9. */
const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(b), 1));

describe('flowGraph on a hand-worked DC chain', () => {
  // Invented scenario: a stiff 48 V bank, a 96 %-efficient 48→24 V converter, a 24 V bus with 10 W
  // of its own, two loads (500 W and 200 W) on the bus.
  const project = {
    format: 'joulepath-project',
    version: 1,
    name: 'Workshop bench supply',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'conv', kind: 'dcdc', from: 'bank', outputVoltage: 24, loss: { model: 'constant', efficiency: 0.96 } },
      { id: 'bus', kind: 'dcbus', from: 'conv', fixedLoss: 10 },
      { id: 'lamp', kind: 'dc-load', from: 'bus', power: 500 },
      { id: 'radio', kind: 'dc-load', from: 'bus', power: 200 },
    ],
  };
  const result = deepFreeze(solved(project));
  const g = flowGraph(result);

  // Hand calculation (constant-efficiency converter: P_in = P_out / η; bus: P_in = Σ loads + fixed loss):
  // bus P_in = 500 + 200 + 10 = 710 W; converter P_in = 710 / 0.96 = 739.5833… W, loss 29.5833… W.
  const busIn = 710;
  const convIn = 710 / 0.96;

  it('has the source, every stage and load, and one loss node per source and stage', () => {
    expect(g.nodes.map((n) => n.id)).toEqual(['bank', lossNodeId('bank'), 'conv', lossNodeId('conv'), 'bus', lossNodeId('bus'), 'lamp', 'radio']);
    expect(g.nodes.filter((n) => n.role === 'loss')).toHaveLength(3);
    expect(g.projectName).toBe('Workshop bench supply');
  });

  it('gives each link the fed element’s P_in or the element’s loss, in watts and per cent of the source', () => {
    near(g.sourcePower, convIn); // stiff bank (no internal resistance): it delivers exactly the converter's input
    near(link(g, 'bank', 'conv').watts, convIn);
    near(link(g, 'bank', lossNodeId('bank')).watts, 0);
    near(link(g, 'conv', 'bus').watts, busIn);
    near(link(g, 'conv', lossNodeId('conv')).watts, convIn - busIn); // 29.58 W (hand calculation above)
    near(link(g, 'bus', lossNodeId('bus')).watts, 10); // the bus's fixed loss, from the project
    near(link(g, 'bus', 'lamp').watts, 500);
    near(link(g, 'bus', 'radio').watts, 200);
    near(link(g, 'bus', 'lamp').percent, (100 * 500) / convIn); // 67.61 % (hand calculation)
    near(link(g, 'conv', lossNodeId('conv')).percent, 4); // 1 − η = 4 % of the converter's input, which is all the source gives
    expect(g.links.every((l) => l.role === (l.target.endsWith('#loss') ? 'loss' : 'feed'))).toBe(true);
    expect(g.conservationError).toBeLessThanOrEqual(1e-12);
  });
});

describe('flowGraph on the demo projects', () => {
  it.each(demoProjects.map((d) => [d.id, d] as const))('%s: conservation at every node, one loss branch per source and stage', (_id, demo) => {
    const result = solved(demo.project);
    const g = flowGraph(result);
    const s = result.totals.sourcePower;
    expect(s).toBeGreaterThan(0);
    // Node inventory: every element once, one loss node for each non-load element.
    const nonLoads = result.elements.filter((e) => e.role !== 'load');
    expect(g.nodes.filter((n) => n.role !== 'loss').map((n) => n.id)).toEqual(result.elements.map((e) => e.id));
    expect(g.nodes.filter((n) => n.role === 'loss').map((n) => n.elementId)).toEqual(nonLoads.map((e) => e.id));
    // At every node: Σ in = Σ out (the source's in is what it delivers).
    for (const n of g.nodes) {
      const inflow = g.links.filter((l) => l.target === n.id).reduce((a, l) => a + l.watts, 0);
      const outflow = g.links.filter((l) => l.source === n.id).reduce((a, l) => a + l.watts, 0);
      if (n.role === 'source') near(outflow / s, n.watts / s);
      else if (n.role === 'stage') near(outflow / s, inflow / s);
      else near(inflow / s, n.watts / s);
    }
    // Σ losses + Σ loads = the source's power, and the engine's own totals agree.
    const lossSum = g.links.filter((l) => l.role === 'loss').reduce((a, l) => a + l.watts, 0);
    const loadSum = g.links.filter((l) => g.nodes.find((n) => n.id === l.target)?.role === 'load').reduce((a, l) => a + l.watts, 0);
    near((lossSum + loadSum) / s, 1);
    near(lossSum / s, result.totals.losses / s);
    near(loadSum / s, result.totals.loadPower / s);
    expect(g.conservationError).toBeLessThanOrEqual(1e-9);
    // Per cent of the source sums to 100 over losses and loads.
    const pct = g.links.filter((l) => l.role === 'loss' || g.nodes.find((n) => n.id === l.target)?.role === 'load').reduce((a, l) => a + l.percent, 0);
    near(pct / 100, 1);
  });

  it('leaves a source that delivers nothing at 0 % rather than dividing by zero', () => {
    const r = solved({
      format: 'joulepath-project',
      version: 1,
      name: 'Idle',
      elements: [
        { id: 'bank', kind: 'battery', voltage: 12 },
        { id: 'off', kind: 'dc-load', from: 'bank', power: 0 },
      ],
    });
    const g = flowGraph(r);
    expect(g.sourcePower).toBe(0);
    expect(g.links.every((l) => l.percent === 0 && Number.isFinite(l.watts))).toBe(true);
    expect(g.conservationError).toBe(0);
  });
});
