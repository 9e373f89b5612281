/**
 * The energy-flow graph (core/studies/energy-flow.ts): a hand-worked chain whose every figure follows from the
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

const link = (g: FlowGraph, source: string, target: string, part?: 'idle' | 'conversion') => {
  const l = g.links.find((x) => x.source === source && x.target === target && (part === undefined || x.part === part));
  if (!l) throw new Error(`no link ${source} → ${target}${part ? ` (${part})` : ''}`);
  return l;
};

/** Σ of the links from an element to its loss node (its idle and conversion parts). */
const lossTotal = (g: FlowGraph, id: string) => g.links.filter((l) => l.source === id && l.target === lossNodeId(id)).reduce((a, l) => a + l.watts, 0);

/** Relative closeness at the brief's 1e-9. */
const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(b), 1));

describe('flowGraph on a hand-worked DC chain', () => {
  // Invented scenario: a stiff 48 V bank, a 96 %-efficient 48→24 V converter, a 24 V bus with 10 W
  // of its own, two loads (500 W and 200 W) on the bus.
  const project = {
    format: 'joulepath-project',
    version: 2,
    name: 'Workshop bench supply',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'conv', kind: 'dc-dc', from: 'bank', outputVoltage: 24, loss: { model: 'constant', efficiency: 0.96 } },
      { id: 'bus', kind: 'dc-bus', from: 'conv', fixedLoss: 10 },
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
    near(lossTotal(g, 'bank'), 0);
    near(link(g, 'conv', 'bus').watts, busIn);
    near(lossTotal(g, 'conv'), convIn - busIn); // 29.58 W (hand calculation above)
    near(lossTotal(g, 'bus'), 10); // the bus's fixed loss, from the project
    near(link(g, 'bus', 'lamp').watts, 500);
    near(link(g, 'bus', 'radio').watts, 200);
    near(link(g, 'bus', 'lamp').percent, (100 * 500) / convIn); // 67.61 % (hand calculation)
    near(link(g, 'conv', lossNodeId('conv'), 'conversion').percent, 4); // 1 − η = 4 % of the converter's input, which is all the source gives
    expect(g.links.every((l) => l.role === (l.target.endsWith('#loss') ? 'loss' : 'feed'))).toBe(true);
    expect(g.conservationError).toBeLessThanOrEqual(1e-12);
  });

  it('splits each loss into its idle part (drawn at zero output) and its conversion part', () => {
    // The bus's 10 W is a fixed loss: all idle, 0 W conversion. The constant-efficiency converter
    // has no idle loss: one conversion link of 29.58 W. The stiff bank loses nothing.
    expect(result.elements.find((e) => e.id === 'bus')!.idleLoss).toBe(10);
    expect(result.elements.find((e) => e.id === 'conv')!.idleLoss).toBeUndefined();
    near(link(g, 'bus', lossNodeId('bus'), 'idle').watts, 10);
    near(link(g, 'bus', lossNodeId('bus'), 'conversion').watts, 0);
    near(link(g, 'conv', lossNodeId('conv'), 'conversion').watts, convIn - busIn);
    expect(g.links.filter((l) => l.source === 'conv' && l.role === 'loss').map((l) => l.part)).toEqual(['conversion']);
    expect(g.links.filter((l) => l.role === 'loss').every((l) => l.part === 'idle' || l.part === 'conversion')).toBe(true);
    expect(g.links.filter((l) => l.role === 'feed').every((l) => l.part === undefined)).toBe(true);
    const busLoss = g.nodes.find((n) => n.id === lossNodeId('bus'))!;
    expect(busLoss.idleWatts).toBe(10);
  });
});

describe('idle and conversion loss of a hand-worked chain', () => {
  // Invented scenario: a stiff 48 V bank feeding a 300 W-rated 48→12 V converter with the converter
  // loss polynomial P_loss = P0 + k1·P + k2·P² (P0 = 3.5 W, k1 = 0.03, k2 = 0.00012 /W), and a 230 V
  // inverter, constant 94 % with 20 W standby, feeding a 750 W load; and a 1 kVA transformer
  // (no-load loss 12 W, load loss 25 W at rating) behind the inverter feeding a 400 W load.
  const project = {
    format: 'joulepath-project',
    version: 2,
    name: 'Cabin split',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'psu', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss: { model: 'polynomial', p0: 3.5, k1: 0.03, k2: 0.00012, ratedPower: 300 } },
      { id: 'radio', kind: 'dc-load', from: 'psu', power: 85 },
      { id: 'inv', kind: 'inverter', from: 'bank', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.94, idleLoss: 20 } },
      { id: 'heater', kind: 'ac-load', from: 'inv', power: 750, powerFactor: 1 },
      { id: 'tx', kind: 'transformer', from: 'inv', ratedApparentPower: 1000, primaryVoltage: 230, secondaryVoltage: 115, noLoadLoss: 12, loadLoss: 25 },
      { id: 'tools', kind: 'ac-load', from: 'tx', power: 400, powerFactor: 1 },
    ],
  };
  const result = deepFreeze(solved(project));
  const g = flowGraph(result);
  const el = (id: string) => result.elements.find((e) => e.id === id)!;

  it('takes P0 of the polynomial as the idle part and the k1, k2 terms as conversion loss', () => {
    // Hand calculation: P_out = 85 W; idle = P0 = 3.5 W; conversion = 0.03·85 + 0.00012·85² = 2.55 + 0.867 = 3.417 W.
    near(el('psu').idleLoss!, 3.5);
    near(el('psu').loss, 3.5 + 3.417);
    near(link(g, 'psu', lossNodeId('psu'), 'idle').watts, 3.5);
    near(link(g, 'psu', lossNodeId('psu'), 'conversion').watts, 3.417);
  });

  it('takes a constant-efficiency converter’s idleLoss and a transformer’s no-load loss as idle', () => {
    near(el('inv').idleLoss!, 20); // the inverter's standby, from the project
    near(el('tx').idleLoss!, 12); // the transformer's no-load (core) loss, from the project
    // Transformer copper loss at unity pf: I²R with R = (25 W / 1000 VA)·Z_b on the secondary, so the
    // conversion part is 25·(S_out/S_rated)²·(115/V_out)² = 25·0.4²·(115/V_out)² ≈ 4 W (IEC 60076-1 load-loss definition).
    const vOut = el('tx').output!.voltage;
    near(link(g, 'tx', lossNodeId('tx'), 'conversion').watts, 25 * (400 / 1000) ** 2 * (115 / vOut) ** 2);
    // Inverter: P_out = 750 + the transformer's input; loss = P_out·(1/0.94 − 1) + 20.
    const invOut = el('inv').pOut;
    near(link(g, 'inv', lossNodeId('inv'), 'conversion').watts, invOut * (1 / 0.94 - 1));
    for (const id of ['psu', 'inv', 'tx']) near(lossTotal(g, id), el(id).loss);
  });

  it('sums the idle and conversion parts of the whole chain and names the largest loss', () => {
    // Idle: 3.5 (P0) + 20 (standby) + 12 (no-load) = 35.5 W, from the project; the stiff bank loses nothing.
    near(g.losses.idle.watts, 35.5);
    near(g.losses.idle.watts + g.losses.conversion.watts, result.totals.losses);
    near(g.losses.total.watts, result.totals.losses);
    near(g.losses.total.percent, (100 * result.totals.losses) / result.totals.sourcePower);
    const biggest = [...result.elements].sort((a, b) => b.loss - a.loss)[0]!;
    expect(g.losses.largest?.elementId).toBe(biggest.id);
    expect(g.losses.largest?.elementId).toBe('inv'); // 750 W + transformer through a 94 % inverter: the largest by far
    near(g.losses.largest!.idleWatts, 20);
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
    // Idle + conversion links of each loss node = the node's loss, and the idle link carries the engine's idleLoss.
    for (const e of nonLoads) {
      near(lossTotal(g, e.id) / s, e.loss / s);
      const idle = g.links.find((l) => l.source === e.id && l.part === 'idle');
      if (e.idleLoss === undefined) expect(idle).toBeUndefined();
      else near(idle!.watts, e.idleLoss);
    }
    // Per cent of the source sums to 100 over losses and loads.
    const pct = g.links.filter((l) => l.role === 'loss' || g.nodes.find((n) => n.id === l.target)?.role === 'load').reduce((a, l) => a + l.percent, 0);
    near(pct / 100, 1);
  });

  it('leaves a source that delivers nothing at 0 % rather than dividing by zero', () => {
    const r = solved({
      format: 'joulepath-project',
      version: 2,
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
    expect(g.losses.largest).toBeUndefined();
    expect(g.losses.total).toEqual({ watts: 0, percent: 0 });
  });
});
