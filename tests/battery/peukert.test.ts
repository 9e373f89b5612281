/**
 * Constant-current discharge against Peukert's law in closed form. The bank's OCV is flat and its
 * internal resistance 0, so a constant-power load draws a constant current I = P / 12 V; with the
 * usable depth of discharge set to 1 the runtime must be the rated-capacity form
 *   t = H·(C/(I·H))^k
 * (Peukert, 1897; rated-capacity form as given in battery makers' application notes, e.g.
 * bdbatteries.com "Peukert's law" and electrotechnik.net "Peukert law and discharge of lead-acid").
 */
import { describe, expect, it } from 'vitest';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { directLoad, flatBank } from './helpers.ts';
import { onSolved } from '../core/solved.ts';

function runtimeHours(capacityAh: number, ratedHours: number, k: number, current: number, timeStepSeconds = 60): number {
  const out = onSolved(simulateDischarge, directLoad(flatBank(capacityAh, ratedHours, k), current * 12, { timeStepSeconds }));
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  // A lead-acid bank in a backup design (the default) runs to its rated capacity at the Peukert rate,
  // which is the charge it gives to its end voltage (IEEE 485 standby sizing).
  expect(out.result.endReason).toBe('rated-capacity');
  return out.result.runtimeSeconds / 3600;
}

describe("Peukert's law, constant current", () => {
  it('published example: C_p = 100 Ah at 1 A, k = 1.2, I = 5 A → t = 100/5^1.2 = 14.5 h (electrotechnik.net worked example)', () => {
    // Classic form C_p = I^k·t is the rated form with H = 100 h, C = 100 Ah (I_rated = 1 A).
    const t = runtimeHours(100, 100, 1.2, 5);
    expect(t).toBeCloseTo(14.496, 3); // 100 / 6.8986 = 14.496 h (recomputed from the published formula)
  });

  it('100 Ah at C20, k = 1.2, I = 10 A → t = 20·(100/200)^1.2 = 8.706 h (rated-capacity form, computed)', () => {
    expect(runtimeHours(100, 20, 1.2, 10)).toBeCloseTo(20 * 0.5 ** 1.2, 9);
    expect(runtimeHours(100, 20, 1.2, 10)).toBeCloseTo(8.706, 3);
  });

  it('rated current returns the rated hours: 100 Ah at C20, I = 5 A → 20 h (sanity check of the form)', () => {
    expect(runtimeHours(100, 20, 1.2, 5)).toBeCloseTo(20, 9);
  });

  it('100 Ah at C20, k = 1.2, I = 20 A → 3.789 h (rated-capacity form, computed)', () => {
    expect(runtimeHours(100, 20, 1.2, 20)).toBeCloseTo(3.789, 3);
  });

  it.each([
    [10, 93.3],
    [20, 87.1],
    [50, 79.4],
    [100, 74.1],
  ])('100 Ah at C20, k = 1.1, I = %d A → available %d Ah = I·t (rated-capacity form, computed)', (current, ah) => {
    const out = onSolved(simulateDischarge, directLoad(flatBank(100, 20, 1.1), current * 12));
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.deliveredAh).toBeCloseTo(ah, 1);
    // The reported Peukert factor is (I/I_rated)^(k−1) at the one current drawn.
    expect(out.result.peukertFactor).toBeCloseTo((current / 5) ** 0.1, 12);
  });

  it('the end inside a step is exact: a 7-minute step gives the same runtime as a 1-minute step', () => {
    expect(runtimeHours(100, 20, 1.2, 10, 420)).toBeCloseTo(runtimeHours(100, 20, 1.2, 10, 60), 9);
  });

  it('below the rated current the rated capacity is taken (no credit for light loads, common practice): 100 Ah, I = 2 A → 50 h', () => {
    expect(runtimeHours(100, 20, 1.2, 2)).toBeCloseTo(50, 9);
  });
});
