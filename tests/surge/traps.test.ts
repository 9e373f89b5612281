/**
 * The trap warnings: each fires on the pattern that reveals the mistake, says why and what to
 * check, and stays quiet on the corrected input. Thresholds are this app's rules (common practice,
 * no source), documented in core/studies/surge/traps.ts.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects, studySurges } from '../../core/index.ts';
import { project } from './fixtures.ts';
import { onSolved } from '../core/solved.ts';

const warnings = (p: unknown) => {
  const o = onSolved(studySurges, p);
  if (!o.ok) throw new Error(JSON.stringify(o.problems));
  return o.result.warnings;
};
const codes = (p: unknown) => warnings(p).map((w) => w.code);
const dcLoad = { id: 'l', kind: 'dc-load', from: 'b', power: 200 };

describe('trap warnings', () => {
  it('Ah added across series: 4 × 12 V blocks entered as 800 Ah (4 × 200); quiet at 200 Ah', () => {
    const bank = (capacityAh: number) => project('bank', [{ id: 'b', kind: 'battery', bank: { chemistry: 'vrla-agm', series: 4, cellsPerBlock: 6, capacityAh } }, dcLoad]);
    const w = warnings(bank(800));
    expect(w.map((x) => x.code)).toContain('ah-added-in-series');
    expect(w[0]!.message).toContain('Ah do not add in series');
    expect(w[0]!.message).toContain('200 Ah');
    expect(codes(bank(200))).not.toContain('ah-added-in-series');
  });

  it('one-way length in a DC drop: a 48 V run dropping 4 % (limit 3 %) warns that a one-way check shows 2 %', () => {
    // I ≈ 1000 W / 48 V ≈ 21 A; R_loop = 2 × 12 m × 4.0 Ω/km = 96 mΩ → about 2 V, 4.2 % (2.0 Ω/km: 2.1 %).
    const run = (rPerKm: number) =>
      project('dc run', [
        { id: 'b', kind: 'battery', voltage: 48, internalResistance: 0.001 },
        { id: 'c', kind: 'cable', from: 'b', length: 12, resistancePerKm: rPerKm },
        { id: 'l', kind: 'dc-load', from: 'c', power: 1000 },
      ]);
    const w = warnings(run(4.0)).find((x) => x.code === 'dc-drop-one-way');
    expect(w?.elementId).toBe('c');
    expect(w!.message).toContain('2 × 12 m');
    expect(codes(run(2.0))).not.toContain('dc-drop-one-way');
  });

  it('inverter far oversized: 5 kW inverter delivering 150 W with 40 W idle loss; quiet at 2 kW', () => {
    const inv = (power: number) =>
      project('inv', [
        { id: 'b', kind: 'battery', voltage: 48, internalResistance: 0.01 },
        { id: 'i', kind: 'inverter', from: 'b', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.92, idleLoss: 40, ratedPower: 5000 } },
        { id: 'l', kind: 'ac-load', from: 'i', power, powerFactor: 1 },
      ]);
    expect(codes(inv(150))).toContain('inverter-oversized');
    expect(codes(inv(2000))).not.toContain('inverter-oversized');
  });

  it('drive fed single-phase without a single-phase rating; quiet with a rating that covers the load', () => {
    const drive = (extra: Record<string, unknown>) =>
      project('drive 1φ', [
        { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
        { id: 'd', kind: 'drive', from: 'g', outputVoltage: 400, outputFrequency: 50, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.96 }, ...extra },
        { id: 'm', kind: 'motor', from: 'd', ratedOutput: 2200, loss: { model: 'constant', efficiency: 0.85 }, powerFactor: { model: 'constant', powerFactor: 0.8 } },
        { id: 's', kind: 'shaft-load', from: 'm', power: 2000 },
      ]);
    const w = warnings(drive({})).find((x) => x.code === 'drive-single-phase');
    expect(w?.message).toContain('derated');
    expect(codes(drive({ singlePhaseRating: 4000 }))).not.toContain('drive-single-phase');
    expect(codes(drive({ singlePhaseRating: 2000 }))).toContain('drive-single-phase');
  });

  it('charging lithium below 0 °C: a LiFePO4 bank with a charger at −5 °C; quiet at +5 °C', () => {
    const cold = (temperatureC: number) =>
      project('cold bank', [{ id: 'b', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, capacityAh: 100 } }, dcLoad], {
        backup: { profile: { kind: 'constant' }, temperatureC, chargerCurrent: 20 },
      });
    const w = warnings(cold(-5)).find((x) => x.code === 'lithium-charge-cold');
    expect(w?.message).toContain('plates lithium');
    expect(codes(cold(5))).not.toContain('lithium-charge-cold');
  });

  it('the three demos raise none of these traps', () => {
    for (const d of demoProjects) expect(codes(d.project), d.id).toEqual([]);
  });
});
