/**
 * Property: over random valid chains (tests/core/arbitraries.ts) every element's loss splits into
 * an idle part and a conversion part:
 * - `idleLoss` is what the element's own parameters say it draws at zero output (the oracle below
 *   reads the project, not the engine's models): a converter's or motor's `idleLoss` (constant and
 *   curve models) or P0 (polynomial; the fitted p0 for polynomial-fit), a DC bus's `fixedLoss`, a
 *   transfer switch's `controlPower`, a transformer's `noLoadLoss`, a standard-loss drive's IEC 61800-9-2 grid loss at zero torque
 *   (held at the grid's lowest torque point); sources, cables and loads have none — each limited to
 *   0…loss;
 * - idle + conversion = loss to 1e-9 relative, in the result and in the flow graph's two loss links;
 * - the idle part of regulating converters, buses, transfer switches and transformers does not move when every load is
 *   halved (it is a no-load figure).
 * Tolerances: 1e-9 relative (the brief's figure for the balance; the solve stops at 1e-12).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { flowGraph, lossNodeId, lossParts, solveProject, type Element, type ElementResult, type LossModel, type Project } from '../../core/index.ts';
import { driveLossAt, driveLossGrid } from '../../core/physics/drive-loss.ts';
import { driveSpeedFraction } from '../../core/kinds/drive.ts';
import { projectArb, scaleLoads } from '../core/arbitraries.ts';

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);
const REL = 1e-9;

const near = (a: number, b: number, what: string) => {
  if (Math.abs(a - b) > REL * Math.max(Math.abs(a), Math.abs(b), 1e-300)) throw new Error(`${what}: ${a} vs ${b}`);
};

/** Zero-output loss of a loss model from its parameters (the fitted p0 comes from the result's fit report). */
function modelIdle(loss: LossModel, r: ElementResult): number {
  switch (loss.model) {
    case 'constant':
    case 'curve':
      return loss.idleLoss ?? 0;
    case 'polynomial':
      return loss.p0;
    case 'polynomial-fit':
      return r.fit!.p0;
  }
}

/** The idle draw the element's parameters give, before the 0…loss limit. */
function expectedIdle(e: Element, r: ElementResult): number {
  switch (e.kind) {
    case 'rectifier':
    case 'dc-dc':
    case 'inverter':
    case 'generic':
      return modelIdle(e.loss, r);
    case 'motor':
      return e.loss ? modelIdle(e.loss, r) : 0; // presets: P_in = P_shaft / η, 0 at no shaft load
    case 'drive': {
      if (e.loss) return modelIdle(e.loss, r);
      const g = driveLossGrid(e.standardLoss!);
      if (!g.ok) throw new Error('a random drive with an invalid grid');
      const phi = driveSpeedFraction(e, { kind: r.input!.kind, ...(r.input!.frequency !== undefined ? { frequency: r.input!.frequency } : {}) }) ?? 1;
      return driveLossAt(g.grid, 100 * phi, 0).loss;
    }
    case 'dc-bus':
      return e.fixedLoss;
    case 'transfer-switch':
      return e.controlPower; // no current through the contacts at zero output (core/kinds/transfer-switch.ts)
    case 'transformer':
      return e.noLoadLoss;
    default:
      return 0; // sources, cables, loads
  }
}

const limited = (idle: number, loss: number) => (idle > 0 && loss > 0 ? Math.min(idle, loss) : 0);

function solved(project: Project) {
  const outcome = solveProject(project);
  if (!outcome.ok) {
    // The only acceptable refusal of a valid random chain (see tests/properties/balance.test.ts).
    expect(outcome.problems.map((p) => p.code)).toEqual(['infeasible-load']);
    return null;
  }
  return outcome.result;
}

describe('idle and conversion loss over random chains', () => {
  it('idleLoss is the zero-output draw of each element’s own parameters, and idle + conversion = loss', () => {
    let runs = 0;
    let withIdle = 0;
    fc.assert(
      fc.property(projectArb, (project) => {
        runs++;
        const result = solved(project);
        if (!result) return;
        const byId = new Map(project.elements.map((e) => [e.id, e]));
        const g = flowGraph(result);
        for (const r of result.elements) {
          const idle = r.idleLoss ?? 0;
          expect(Number.isFinite(idle)).toBe(true);
          if (r.idleLoss !== undefined) {
            withIdle++;
            expect(r.idleLoss).toBeGreaterThan(0);
            expect(r.idleLoss).toBeLessThanOrEqual(r.loss);
          }
          if (r.role === 'load') {
            expect(r.idleLoss).toBeUndefined();
            continue;
          }
          near(idle, limited(expectedIdle(byId.get(r.id)!, r), r.loss), `${r.id} (${r.kind}) idle loss`);
          const { idle: i, conversion } = lossParts(r);
          expect(conversion).toBeGreaterThanOrEqual(0);
          near(i + conversion, r.loss, `${r.id} idle + conversion`);
          // The flow graph: the loss node's in-links are the two parts, and they sum to the loss.
          const parts = g.links.filter((l) => l.target === lossNodeId(r.id));
          expect(parts.map((l) => l.part)).toEqual(i > 0 ? ['idle', 'conversion'] : ['conversion']);
          near(parts.reduce((a, l) => a + l.watts, 0), r.loss, `${r.id} loss links`);
        }
      }),
      { numRuns: 150 * SCALE },
    );
    // The generator gives idle losses often enough for the check to mean something.
    expect(withIdle).toBeGreaterThan(runs / 2);
  });

  it('the idle part of converters, buses and transformers does not change when the loads are halved', () => {
    fc.assert(
      fc.property(projectArb, (project) => {
        const full = solved(project);
        const half = solved(scaleLoads(project, 0.5));
        if (!full || !half) return;
        const halfById = new Map(half.elements.map((e) => [e.id, e]));
        for (const r of full.elements) {
          if (!['rectifier', 'dc-dc', 'inverter', 'generic', 'dc-bus', 'transfer-switch', 'transformer'].includes(r.kind)) continue;
          const h = halfById.get(r.id)!;
          // Only where the 0…loss limit acts on neither (it can, for a fit with a negative term).
          if (r.idleLoss === undefined || h.idleLoss === undefined || h.idleLoss >= h.loss || r.idleLoss >= r.loss) continue;
          near(h.idleLoss, r.idleLoss, `${r.id} idle at half load`);
        }
      }),
      { numRuns: 60 * SCALE },
    );
  });
});
