/**
 * Property: over random valid chains (tests/core/arbitraries.ts) the energy-flow graph conserves
 * power at every node (Σ in = Σ out), and Σ loss links + Σ load links = the source's power,
 * to 1e-9 of the source power (the brief's tolerance; the solve itself stops at 1e-12).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { flowGraph, solveProject } from '../../core/index.ts';
import { projectArb } from '../core/arbitraries.ts';

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);
const REL = 1e-9;

describe('energy-flow graph over random chains', () => {
  it('conserves power at every node and in total', () => {
    let runs = 0;
    let solved = 0;
    fc.assert(
      fc.property(projectArb, (project) => {
        runs++;
        const outcome = solveProject(project);
        if (!outcome.ok) {
          // The only acceptable refusal of a valid random chain (see tests/properties/balance.test.ts).
          expect(outcome.problems.map((p) => p.code)).toEqual(['infeasible-load']);
          return;
        }
        solved++;
        const g = flowGraph(outcome.result);
        const s = outcome.result.totals.sourcePower;
        const tol = REL * Math.max(Math.abs(s), 1e-300);
        const inflow = new Map<string, number>();
        const outflow = new Map<string, number>();
        for (const l of g.links) {
          expect(Number.isFinite(l.watts) && Number.isFinite(l.percent)).toBe(true);
          inflow.set(l.target, (inflow.get(l.target) ?? 0) + l.watts);
          outflow.set(l.source, (outflow.get(l.source) ?? 0) + l.watts);
        }
        for (const n of g.nodes) {
          const inW = n.role === 'source' ? n.watts : (inflow.get(n.id) ?? 0);
          // Loads and loss nodes are sinks: their out is the node's own figure.
          const outW = n.role === 'load' || n.role === 'loss' ? n.watts : (outflow.get(n.id) ?? 0);
          if (Math.abs(inW - outW) > tol) throw new Error(`${n.id} (${n.role}): in ${inW} W, out ${outW} W`);
        }
        const sinks = g.links
          .filter((l) => {
            const role = g.nodes.find((n) => n.id === l.target)?.role;
            return role === 'loss' || role === 'load';
          })
          .reduce((a, l) => a + l.watts, 0);
        if (Math.abs(sinks - s) > tol) throw new Error(`losses + loads ${sinks} W vs source ${s} W`);
        expect(g.conservationError).toBeLessThanOrEqual(REL);
      }),
      { numRuns: 150 * SCALE },
    );
    expect(solved / runs).toBeGreaterThanOrEqual(0.8);
  });
});
