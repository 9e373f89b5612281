/**
 * The transfer switch element (core/kinds/transfer-switch.ts) worked by hand: contact I²R per
 * current-carrying conductor (DC 2, three-phase 3) plus its control power, its rated-current warning,
 * and a switch in both modes of a bank on a bus (the harbour clinic demo's UPS output switch; a switch
 * on the supply side of a DC plant): its loss in both modes, in the standing losses, the break its
 * loads see, and both modes' energy balance.
 */
import { describe, expect, it } from 'vitest';
import { solvedOf } from '../core/solved.ts';
import { solveModes } from '../../core/solve/modes.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { formatModesStudy } from '../../core/studies/modes/text-report.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { solveProject } from '../../core/solve/index.ts';

const project = (elements: unknown[], extra: Record<string, unknown> = {}) => ({ format: 'joulepath-project', version: 2, name: 'switch', elements, ...extra });

describe('a transfer switch passes its input on with its own losses', () => {
  it('DC: 2·I²·R + control power (hand calculation, Ohm and Joule)', () => {
    // 48 V ideal bank → switch (1 mΩ per pole, 10 W control) → 480 W constant-power load.
    // Loop 2R = 2 mΩ: V_r = (48 + √(48² − 4·0.002·480)) / 2 = 47.979992 V, I = 480 / V_r = 10.004170 A,
    // contacts 2·I²·0.001 = 0.200167 W; source 480 + 0.200167 + 10 = 490.200167 W (hand calculation).
    const s = solvedOf(project([
      { id: 'bat', kind: 'battery', voltage: 48, internalResistance: 0 },
      { id: 'sw', name: 'Switch', kind: 'transfer-switch', from: 'bat', contactResistance: 0.001, controlPower: 10, ratedCurrent: 8, transferTime: 0.01 },
      { id: 'load', kind: 'dc-load', from: 'sw', power: 480 },
    ]));
    const sw = s.result.elements.find((e) => e.id === 'sw')!;
    expect(sw.output!.voltage).toBeCloseTo(47.979992, 5);
    expect(sw.output!.current).toBeCloseTo(10.00417, 5);
    expect(sw.loss).toBeCloseTo(10.200167, 6);
    // The control power is the switch's idle draw (zero output: no current through the contacts).
    expect(sw.idleLoss).toBeCloseTo(10, 9);
    expect(s.result.totals.sourcePower).toBeCloseTo(490.200167, 6);
    expect(s.result.totals.balanceError).toBeLessThanOrEqual(1e-9);
    // 10.0 A through a switch rated 8 A: the rating warning names both currents.
    const w = s.result.warnings.find((x) => x.elementId === 'sw');
    expect(w?.code).toBe('rating-exceeded');
    expect(w?.message).toBe('carries 10 A, above its rated current 8 A');
  });

  it('three-phase: 3·I²·R (one pole per phase) + control power (hand calculation)', () => {
    // 400 V ideal supply → switch (0.5 mΩ per pole, 15 W) → 30 kW at unity power factor.
    // Per phase V_s = 400/√3 = 230.940108 V, 10 kW: V_r = (V_s + √(V_s² − 4·0.0005·10000)) / 2 = 230.918455 V,
    // I = 10000 / V_r = 43.305330 A, contacts 3·I²·0.0005 = 2.813027 W; source 30017.813027 W (hand calculation).
    const s = solvedOf(project([
      { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'sw', kind: 'transfer-switch', from: 'grid', contactResistance: 0.0005, controlPower: 15, ratedCurrent: 63 },
      { id: 'load', kind: 'ac-load', from: 'sw', power: 30000, powerFactor: 1 },
    ]));
    const sw = s.result.elements.find((e) => e.id === 'sw')!;
    expect(sw.output!.current).toBeCloseTo(43.30533, 4);
    expect(sw.loss).toBeCloseTo(17.813027, 5);
    expect(s.result.totals.sourcePower).toBeCloseTo(30017.813027, 5);
    expect(s.result.totals.balanceError).toBeLessThanOrEqual(1e-9);
    // 43.3 A within its 63 A: no warning.
    expect(s.result.warnings.filter((x) => x.elementId === 'sw')).toEqual([]);
  });
});

describe('a transfer switch in both modes', () => {
  const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;

  it("the harbour clinic's UPS output switch: its loss in both modes and in the standing losses, no break on the inverter's output", () => {
    const solved = solvedOf(demo.project);
    const modes = solveModes(solved)!;
    expect(modes.battery.ok).toBe(true);
    if (!modes.battery.ok) return;
    for (const r of [solved.result, modes.battery.result]) {
      const sw = r.elements.find((e) => e.id === 'output-switch')!;
      // Single-phase: 2 poles carry the current: loss = 2·I²·R + P_control, R = 1 mΩ, 20 W (the demo's figures),
      // I the current through the contacts (the switch's output current; Joule's law).
      expect(sw.loss).toBeCloseTo(2 * sw.output!.current ** 2 * 0.001 + 20, 9);
      // 16.0 A through the demo's switch: 2 × 16.03² × 0.001 = 0.514 W + 20 W (hand calculation).
      expect(sw.loss).toBeCloseTo(20.514, 2);
      expect(r.totals.balanceError).toBeLessThanOrEqual(1e-9);
    }
    const study = runModesStudy(solved, modes);
    if (!study?.ok) throw new Error('the modes study failed');
    const st = study.study;
    expect(st.standing.switches).toBeCloseTo(solved.result.elements.find((e) => e.id === 'output-switch')!.loss, 12);
    // The standing losses add up: conversion + idle + cables + switches + supply + float (the study's sum).
    const s = st.standing;
    expect(s.total).toBeCloseTo(s.conversion + s.idle + s.cables + s.switches + s.source + s.bankFloat, 9);
    // On supply every loss of the solve is a standing loss (the float drawn as the bank's load power).
    expect(s.total).toBeCloseTo(solved.result.totals.losses + s.bankFloat, 9);
    const [sw] = st.switches;
    expect(sw).toMatchObject({ id: 'output-switch', name: 'UPS output transfer switch', transferTime: 0.004, onInverterOutput: true, inverterName: 'UPS inverter', breakTime: 0 });
    expect(sw!.lossOnBattery).not.toBeNull();
    expect(formatModesStudy(st)).toContain('UPS output transfer switch: 20.51 W on supply, 20.51 W on battery; on the output of "UPS inverter": its loads see no break when the supply is cut (the inverter carries on from the bank); its 4 ms transfer applies when it moves them to a bypass');
  });

  it('a switch on the supply side of a DC plant: cut on battery, its loads see a break of its transfer time', () => {
    const solved = solvedOf(project([
      { id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
      { id: 'ats', name: 'Supply transfer switch', kind: 'transfer-switch', from: 'grid', contactResistance: 0.002, controlPower: 8, transferTime: 0.1 },
      { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'ats', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
      { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 0 },
      { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 } },
      { id: 'radio', name: 'Radio', kind: 'dc-current-load', from: 'bus', current: 30 },
    ]));
    // Rectifier input 54 × 30.2 ÷ 0.9 = 1812 W (as tests/modes/dc-plant.test.ts); at 230 V the switch carries
    // about 1812/230 = 7.88 A: 2 × 7.88² × 0.002 = 0.248 W + 8 W (hand calculation, Joule's law).
    const sw = solved.result.elements.find((e) => e.id === 'ats')!;
    expect(sw.loss).toBeCloseTo(2 * sw.output!.current ** 2 * 0.002 + 8, 9);
    expect(sw.loss).toBeCloseTo(8.248, 2);
    const study = runModesStudy(solved);
    if (!study?.ok) throw new Error('the modes study failed');
    const [w] = study.study.switches;
    expect(w).toMatchObject({ onInverterOutput: false, breakTime: 0.1, lossOnBattery: null });
    expect(w!.note).toBe('its loads see a break of 100 ms when it transfers (those on the bus "DC bus" see none: the bank holds the bus)');
    expect(study.study.standing.switches).toBeCloseTo(sw.loss, 12);
    if ('ok' in study.study.battery) throw new Error('no on-battery mode');
    expect(study.study.battery.balanceError).toBeLessThanOrEqual(1e-9);
    expect(study.study.supply.balanceError).toBeLessThanOrEqual(1e-9);
  });
});

describe('a transfer switch refuses what no switch has', () => {
  const withSwitch = (sw: Record<string, unknown>) => solveProject(project([
    { id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'sw', name: 'Switch', kind: 'transfer-switch', from: 'grid', contactResistance: 0.001, controlPower: 10, ...sw },
    { id: 'load', kind: 'ac-load', from: 'sw', power: 1000, powerFactor: 1 },
  ]));
  const problemOf = (sw: Record<string, unknown>) => {
    const out = withSwitch(sw);
    if (out.ok) throw new Error('accepted');
    return out.problems.map((p) => `${p.field}: ${p.message}`);
  };
  it('names the field and the problem', () => {
    // The plausible range of a contact resistance: 0 to 1 Ω (core/kinds/ranges.ts, common practice (no source)).
    expect(problemOf({ contactResistance: -0.001 })).toEqual(['contactResistance: must not be negative Ω']);
    expect(problemOf({ contactResistance: 5 })).toEqual(['contactResistance: must not exceed 1 Ω: the plausible range of a contact resistance is 0 Ω to 1 Ω (check the value and its unit)']);
    expect(problemOf({ controlPower: -1 })).toEqual(['controlPower: must not be negative W']);
    expect(problemOf({ transferTime: -0.004 })).toEqual(['transferTime: must not be negative s']);
    expect(problemOf({ ratedCurrent: 0 })).toEqual(['ratedCurrent: must be greater than 0 A']);
    expect(problemOf({ contactResistance: undefined })[0]).toMatch(/^contactResistance: /);
  });
  it('takes no shaft', () => {
    const out = solveProject(project([
      { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'm', kind: 'motor', from: 'grid', ratedOutput: 7500, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
      { id: 'sw', kind: 'transfer-switch', from: 'm', contactResistance: 0.001, controlPower: 10 },
      { id: 'load', kind: 'shaft-load', from: 'sw', power: 1000 },
    ]));
    expect(out.ok).toBe(false);
  });
});
