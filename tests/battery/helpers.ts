/** Small projects for the battery tests (invented scenarios). */
import type { BackupStudy, BatteryBankSpec, Element, Project } from '../../core/index.ts';

/** A bank feeding one DC load directly: the simplest chain, for closed-form checks. */
export function directLoad(bank: BatteryBankSpec, power: number, study: Partial<BackupStudy> = {}, extra: Element[] = []): Project {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'test: bank and one DC load',
    elements: [{ id: 'bank', kind: 'battery', bank }, { id: 'load', kind: 'dc-load', from: 'bank', power }, ...extra],
    backup: { profile: { kind: 'constant' }, horizonHours: 400, ...study },
  };
}

/**
 * A 12 V bank whose open-circuit voltage is flat at 2.0 V/cell and whose internal resistance is 0:
 * a constant-power load then draws a constant current I = P/12 V, so Peukert's law applies in closed form.
 */
export function flatBank(capacityAh: number, ratedHours: number, peukertExponent: number): BatteryBankSpec {
  return {
    chemistry: 'flooded-lead-acid',
    series: 6,
    capacityAh,
    overrides: {
      ocvCurve: [
        { soc: 0, voltage: 2 },
        { soc: 1, voltage: 2 },
      ],
      internalResistanceOhmAh: 0,
      usableDepthOfDischarge: 1,
      peukertExponent,
      ratedHours,
      capacityVsTemperature: [{ temperatureC: 25, capacityFactor: 1 }],
      maxDischargeCRate: 5,
    },
  };
}
