/**
 * Property: over random valid chains whose stages may be transfer switches (tests/core/arbitraries.ts,
 * `projectWithSwitchesArb`), every switch passes its port kind on, its loss is n·I²·R + its control
 * power (n the current-carrying conductors: 2 on DC and single-phase, 3 on three-phase; Joule's law per
 * pole, core/kinds/transfer-switch.ts), its idle draw is its control power, and the chain balances to
 * 1e-9 relative (the tolerance; the solve stops at 1e-12). Fixed seed; JP_FC_SCALE for more.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveProject } from '../../core/index.ts';
import type { TransferSwitchStage } from '../../core/model/project.ts';
import { projectWithSwitchesArb } from '../core/arbitraries.ts';

const SCALE = Math.max(1, Number(process.env['JP_FC_SCALE'] ?? '1') || 1);

describe('transfer switches in random chains', () => {
  it('pass their port on with n·I²·R + control power, idle = control power, balance to 1e-9', () => {
    let switches = 0;
    fc.assert(
      fc.property(projectWithSwitchesArb, (project) => {
        const out = solveProject(project);
        if (!out.ok) {
          // The only acceptable refusal of a valid random chain (as tests/properties/balance.test.ts).
          expect(out.problems.map((p) => p.code)).toEqual(['infeasible-load']);
          return;
        }
        expect(out.result.totals.balanceError).toBeLessThan(1e-9);
        const byId = new Map(project.elements.map((e) => [e.id, e]));
        for (const r of out.result.elements) {
          if (r.kind !== 'transfer-switch') continue;
          switches++;
          const e = byId.get(r.id) as TransferSwitchStage;
          expect(r.output!.kind).toBe(r.input!.kind);
          const n = r.input!.kind === 'ac3' ? 3 : 2;
          const joule = n * r.output!.current ** 2 * e.contactResistance + e.controlPower;
          expect(Math.abs(r.loss - joule)).toBeLessThanOrEqual(1e-9 * Math.max(1, r.pIn));
          // (a control power lost in the rounding of P_in − P_out gives no idle part: the idle part is limited to 0…loss)
          if (e.controlPower > 1e-9 * Math.max(1, r.pIn)) expect(r.idleLoss).toBeCloseTo(e.controlPower, 9);
        }
      }),
      { numRuns: 80 * SCALE, seed: 190001 },
    );
    expect(switches).toBeGreaterThan(10);
  });
});
