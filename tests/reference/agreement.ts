/**
 * Agreement between the engine and ngspice for one case: every figure asserted within the
 * tolerances the issue sets (0.1 % relative, 0.01° in angle), the worst kept for the summary.
 */
import { afterAll, expect } from 'vitest';
import type { Project } from '../../core/model/project.ts';

/** Relative tolerance of the reference checks: 0.1 %. */
export const REL_TOL = 1e-3;
/** Angle tolerance, degrees. */
export const ANGLE_TOL_DEG = 0.01;

/** Records the agreement of one case and asserts each figure. */
export class Agreement {
  worstRel = 0;
  worstRelWhat = '';
  worstAngle = 0;
  rows: string[] = [];
  constructor(readonly name: string) {}
  rel(what: string, engine: number, spice: number): void {
    const err = Math.abs(engine - spice) / Math.abs(spice);
    this.rows.push(`${what}: engine ${engine.toPrecision(10)}, ngspice ${spice.toPrecision(10)}, rel ${err.toExponential(2)}`);
    if (err > this.worstRel) {
      this.worstRel = err;
      this.worstRelWhat = what;
    }
    expect(err, `${this.name} — ${what}: engine ${engine}, ngspice ${spice}`).toBeLessThanOrEqual(REL_TOL);
  }
  angle(what: string, engineDeg: number, spiceDeg: number): void {
    let d = Math.abs(engineDeg - spiceDeg) % 360;
    if (d > 180) d = 360 - d;
    this.rows.push(`${what}: engine ${engineDeg.toFixed(6)}°, ngspice ${spiceDeg.toFixed(6)}°, diff ${d.toExponential(2)}°`);
    this.worstAngle = Math.max(this.worstAngle, d);
    expect(d, `${this.name} — ${what}: engine ${engineDeg}°, ngspice ${spiceDeg}°`).toBeLessThanOrEqual(ANGLE_TOL_DEG);
  }
  /** A quantity that should be zero in both (e.g. neutral current of a balanced load), absolute bound. */
  nearZero(what: string, spice: number, bound: number): void {
    this.rows.push(`${what}: ngspice ${spice.toExponential(2)} (bound ${bound})`);
    expect(Math.abs(spice), `${this.name} — ${what}`).toBeLessThanOrEqual(bound);
  }
}

/** A project of the given elements (test data; validated by the solve). */
export const projectOf = (name: string, elements: unknown[]): Project => ({ format: 'joulepath-project', version: 2, name, elements }) as Project;

/** Collects each case's agreement and prints the worst figures of every case when the file ends. */
export function agreementSummary(title: string): Agreement[] {
  const summary: Agreement[] = [];
  afterAll(() => {
    if (summary.length === 0) return;
    const lines = summary.map((a) => `  ${a.name}: worst relative error ${a.worstRel.toExponential(2)} (${a.worstRelWhat}), worst angle error ${a.worstAngle.toExponential(2)}°`);
    console.log(`${title}:\n${lines.join('\n')}`);
  });
  return summary;
}
