/**
 * Bank sizing, part 7 of 7: the energy method for lithium (LiFePO4, NMC) — energy ÷ (usable depth of
 * discharge × capacity factor) × design margin × aging, bounded by the discharge C-rate (header of
 * sizing.ts, step 3).
 */
import { capacityFactorAt as extrapolatedCapacityFactor } from '../../physics/bank.ts';
import { TYPICAL_VALUE } from './cautions.ts';
import { round, type GoverningLimit, type MethodContext, type MethodOutcome, type SizingMethod } from './sizing-types.ts';
import { sigText } from '../../model/message.ts';

/** Sizes a lithium bank by its energy. */
export function sizeByEnergy(ctx: MethodContext): MethodOutcome {
  const { input, preset, periods, nominalVoltage, step, userSource, warnings, peakCurrent, temperature, designMargin, agingFactor } = ctx;
  const duty = input.dutyCycle;
  const random = input.randomLoad;
  let energyWh = ctx.energyWh;
  let required: number;
  let governing: GoverningLimit;
  let method: SizingMethod;

  // Lithium: energy method.
  method = 'energy';
  step(
    'Energy at the bank terminals',
    energyWh,
    'Wh',
    duty.basis === 'power' ? 'Σ power × duration' : `Σ current × duration × ${round(nominalVoltage)} V nominal`,
  );
  if (random !== undefined) {
    const er = 'current' in random ? (random.current * nominalVoltage * random.duration) / 3600 : (random.power * random.duration) / 3600;
    step('Random-load energy', er, 'Wh', 'added once');
    energyWh += er;
  }
  const dod = preset.usableDepthOfDischarge;
  const cap = extrapolatedCapacityFactor(preset.capacityVsTemperature, temperature);
  const capFactor = cap.factor;
  step('Usable depth of discharge', dod, '', userSource('usableDepthOfDischarge'));
  step('Capacity factor at temperature', capFactor, '', `${sigText(temperature, 3)} °C (${userSource('capacityVsTemperature')}${cap.extrapolated ? '; outside the table: extrapolated along its end slope, never above its end value' : ''})`);
  step('Design margin', designMargin, '', input.designMargin === undefined ? `default 1.10 (the IEEE 485 design margin applied to lithium; ${TYPICAL_VALUE})` : 'as given');
  step('Aging factor', agingFactor, '', input.agingFactor === undefined ? `default 1.25 (end of life at 80 % of rated; ${TYPICAL_VALUE})` : 'as given');
  const wh = (energyWh / (dod * capFactor)) * designMargin * agingFactor;
  step('Required energy', wh, 'Wh', 'energy ÷ (DoD × capacity factor) × design margin × aging');
  const energyAh = wh / nominalVoltage;
  step('Required capacity (energy)', energyAh, 'Ah', `${round(wh)} Wh ÷ ${round(nominalVoltage)} V nominal`);
  const rateAh = peakCurrent / preset.maxDischargeCRate;
  step(
    'Required capacity (discharge rate)',
    rateAh,
    'Ah',
    `peak ${round(peakCurrent)} A ÷ ${preset.maxDischargeCRate} C maximum continuous discharge (${userSource('maxDischargeCRate')})`,
  );
  if (rateAh > energyAh) {
    required = rateAh;
    governing = { kind: 'discharge-rate' };
    warnings.push(
      `The peak current sets the size: ${round(peakCurrent)} A needs at least ${round(rateAh)} Ah at ${preset.maxDischargeCRate} C, more than the energy needs (${round(energyAh)} Ah).`,
    );
  } else {
    required = energyAh;
    governing = { kind: 'energy' };
  }
  return { ok: true, method, required, governing, sections: [], worksheetPeriods: periods };
}
