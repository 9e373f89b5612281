/**
 * The energy-flow diagram's layout (web/components/flow-layout.ts) as pure geometry, in Node with the
 * rough text measure: names wrap without losing a character, feed branches stay in the gaps between
 * columns and loss branches and labels inside their column, each loss label is centred under its own
 * stage, no two blocks or labels of one column overlap, and the pipes are to scale. The same checks
 * on the page (real fonts, sampled paths) are in tests/browser/flow.test.ts. The rules checked are
 * the layout's own design (common practice for a Sankey diagram, no source); the figures come from
 * the engine (solveProject, flowGraph).
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, flowGraph, solveProject, type Project } from '../../core/index.ts';
import { COLUMN, columnX, GAP, layout, LINE, MAX_NAME_LINES, roughMeasure, wrap } from '../../web/components/flow-layout.ts';
import { deepCables } from '../bench/chains.ts';
import { thirtyElementChain } from '../bench/flow-chain.ts';

const graphOf = (p: Project) => {
  const outcome = solveProject(p);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
  return flowGraph(outcome.result);
};

describe('wrap', () => {
  it('keeps every character and every line within the room', () => {
    const name = 'Inverter for the cold-room controls and lighting, bay 2';
    const lines = wrap(name.split(' '), ' ', 100, true, roughMeasure);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.join(' ')).toBe(name);
    for (const l of lines) expect(roughMeasure(l, true)).toBeLessThanOrEqual(100);
  });
  it('breaks a word longer than a line between characters, never cutting it off', () => {
    const word = 'Supercalifragilisticexpialidocious-feeder-cable';
    const lines = wrap([word], ' ', 80, true, roughMeasure);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.join('')).toBe(word);
    for (const l of lines) expect(roughMeasure(l, true)).toBeLessThanOrEqual(80);
  });
});

const projects: [string, Project][] = [...demoProjects.map((d): [string, Project] => [d.id, d.project]), ['thirty-element chain', thirtyElementChain()]];

describe.each(projects)('the layout of %s', (_id, project) => {
  const g = graphOf(project);
  const laid = layout(g, 390, 'en-US')!;
  const byId = new Map(laid.nodes.map((n) => [n.id, n]));

  it('keeps feed branches in the gaps and loss branches in their column', () => {
    for (const l of laid.links) {
      if (l.role === 'feed') {
        // From the right end of a column to the left end of the next.
        expect(l.sx).toBeCloseTo(columnX(l.sourceNode.column) + COLUMN, 6);
        expect(l.tx).toBeCloseTo(columnX(l.sourceNode.column + 1), 6);
        expect(l.targetNode.column).toBe(l.sourceNode.column + 1);
      } else {
        // Straight down from the pipe's bottom to the loss block, inside the stage's column.
        expect(l.sx).toBe(l.tx);
        expect(l.sx - l.width / 2).toBeGreaterThanOrEqual(columnX(l.sourceNode.column) - 1e-9);
        expect(l.sx + l.width / 2).toBeLessThanOrEqual(columnX(l.sourceNode.column) + COLUMN + 1e-9);
        expect(l.sy).toBe(l.sourceNode.y1);
        expect(l.ty).toBe(l.targetNode.y0);
      }
    }
    expect(GAP).toBeGreaterThan(0);
  });

  it('centres each loss label under its own stage and keeps every label in its column', () => {
    for (const label of laid.labels) {
      const n = byId.get(label.id)!;
      const x0 = columnX(n.column);
      if (n.role === 'loss') {
        const stage = byId.get(n.elementId)!;
        expect(label.anchor).toBe('middle');
        expect(label.x).toBeCloseTo((stage.x0 + stage.x1) / 2, 6);
        expect(label.y).toBeGreaterThan(n.y1);
      } else {
        expect(label.x).toBe(x0);
        // Above its pipe: the last line's baseline at most 4 px over the pipe's top.
        expect(label.y + (label.lines.length - 1) * LINE).toBeLessThanOrEqual(n.y0);
      }
      for (const line of label.lines) expect(roughMeasure(line.text, line.bold)).toBeLessThanOrEqual(COLUMN);
    }
  });

  it('overlaps no two boxes (pipe, loss, label) of one column', () => {
    type Box = { id: string; y0: number; y1: number; column: number };
    const boxes: Box[] = [];
    for (const n of laid.nodes) boxes.push({ id: n.id, y0: n.y0, y1: n.y1, column: n.column });
    for (const label of laid.labels) {
      const n = byId.get(label.id)!;
      boxes.push({ id: `${label.id} label`, y0: label.y - 11, y1: label.y + (label.lines.length - 1) * LINE + 4, column: n.column });
    }
    const clashes: string[] = [];
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!;
        const b = boxes[j]!;
        if (a.column === b.column && a.y0 < b.y1 - 0.01 && b.y0 < a.y1 - 0.01) clashes.push(`${a.id} / ${b.id}`);
      }
    expect(clashes).toEqual([]);
  });

  it('attaches the feeds as d3-sankey stacks them: from the pipe’s top in the chain’s order into the top of the next pipe, a first child level with its parent', () => {
    for (const n of laid.nodes.filter((x) => x.role !== 'loss')) {
      // Feeds out, in the graph's order (the chain's): each starts where the one above it ends.
      const out = laid.links.filter((l) => l.role === 'feed' && l.sourceNode.id === n.id);
      let top = n.y0;
      for (const l of out) {
        expect(l.sy - l.width / 2).toBeCloseTo(top, 6);
        expect(l.ty - l.width / 2).toBeCloseTo(l.targetNode.y0, 6);
        top += l.width;
      }
      expect(top).toBeLessThanOrEqual(n.y1 + 1e-6);
      if (out[0]) expect(out[0].targetNode.y0).toBeCloseTo(n.y0, 6);
    }
  });

  it('leaves the graph it is given as it was (d3-sankey writes into its input, so it gets copies)', () => {
    const before = JSON.stringify(g);
    layout(g, 1200, 'en-US');
    expect(JSON.stringify(g)).toBe(before);
    expect(laid.nodes.every((n) => !('sourceLinks' in n))).toBe(true);
  });

  it('draws every name in full and the pipes to scale', () => {
    for (const n of g.nodes.filter((x) => x.role !== 'loss')) {
      const label = laid.labels.find((l) => l.id === n.id)!;
      // Lines broken at a space keep it at their end (not drawn; the file's text then reads as the name).
      expect(label.lines.filter((l) => l.bold).map((l) => l.text).join('')).toBe(n.name.split(/\s+/).join(' '));
    }
    const source = laid.nodes.find((n) => n.role === 'source')!;
    const ky = (source.y1 - source.y0) / source.watts;
    for (const n of laid.nodes.filter((x) => x.role !== 'loss' && x.watts * ky >= 2)) expect(n.y1 - n.y0).toBeCloseTo(n.watts * ky, 6);
    for (const l of laid.links) expect(l.width).toBeCloseTo(l.watts * ky, 6);
  });
});

it('shortens only a name past its lines, ending it with an ellipsis and keeping the full name for the legend', () => {
  // An invented pasted name of 400 characters (ten times a plain sentence).
  const long = 'Feeder from the main board to the far pump house. '.repeat(8).trim();
  const project: Project = {
    format: 'joulepath-project',
    version: 2,
    name: 'Long name',
    elements: [
      { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.03 },
      { id: 'run', name: long, kind: 'cable', from: 'grid', length: 50, resistancePerKm: 0.727, reactancePerKm: 0.08 },
      { id: 'pump', name: 'Pump', kind: 'ac-load', from: 'run', power: 5000, powerFactor: 0.85 },
    ],
  };
  const laid = layout(graphOf(project), 390, 'en-US')!;
  const run = laid.labels.find((l) => l.id === 'run')!;
  const name = run.lines.filter((l) => l.bold).map((l) => l.text);
  expect(name).toHaveLength(MAX_NAME_LINES);
  expect(name[name.length - 1]!.endsWith('…')).toBe(true);
  expect(long.startsWith(name.join('').slice(0, -1))).toBe(true);
  expect(run.fullName).toBe(long);
  expect(laid.labels.find((l) => l.id === 'pump')!.fullName).toBeUndefined();
  // A 5000-character word (no spaces) is broken quickly, not character by character.
  const t = performance.now();
  expect(wrap(['x'.repeat(5000)], ' ', 100, true, roughMeasure).join('')).toBe('x'.repeat(5000));
  expect(performance.now() - t).toBeLessThan(2000);
});

it('lays out a run of 2000 elements (the import limit) without running out of stack', () => {
  const laid = layout(graphOf(deepCables(2000)), 390, 'en-US')!;
  expect(laid.columns).toBe(2000);
  expect(Number.isFinite(laid.height)).toBe(true);
});
