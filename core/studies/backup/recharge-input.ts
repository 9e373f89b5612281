/**
 * Recharge, part 2 of 3: the input checks — the chemistry preset, the bank, the charger, the charge
 * profile, the standing load and the target, each refusal naming its field — and the model
 * constants (τ, current ceiling, end state of charge) they give.
 */
import type { Problem } from '../../model/errors.ts';
import { PROJECT_LEVEL } from '../../model/errors.ts';
import { isLithium } from './cautions.ts';
import { problem, resolvePreset } from './sizing-input.ts';
import {
  CHARGE_PROFILES,
  DEFAULT_CHARGER_EFFICIENCY,
  DEFAULT_FIELDS,
  pct,
  type ChargeProfile,
  type Model,
  type RechargeBase,
  type RechargeFieldPaths,
} from './recharge-types.ts';

export const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

export function checkBase(input: RechargeBase): { ok: true; m: Model } | { ok: false; problems: Problem[] } {
  const elementId = input.elementId ?? PROJECT_LEVEL;
  const fields: RechargeFieldPaths = { ...DEFAULT_FIELDS, ...(input.fields ?? {}) };
  const resolved = resolvePreset(input.chemistry, input.overrides, elementId, fields.chemistry, fields.overrides);
  if (!resolved.ok) return resolved;
  const preset = resolved.preset;
  const out: Problem[] = [];
  const bad = (field: string, value: unknown, message: string) => out.push(problem('invalid-value', elementId, field, value, message));

  if (!isFiniteNumber(input.capacity) || input.capacity <= 0) bad(fields.capacity, input.capacity, 'bank capacity must be greater than 0 Ah');
  if (!Number.isInteger(input.seriesCells) || input.seriesCells < 1) bad(fields.seriesCells, input.seriesCells, 'cells in series must be a whole number of at least 1');
  if (!isFiniteNumber(input.startSoc) || input.startSoc < 0 || input.startSoc > 1) bad(fields.startSoc, input.startSoc, 'state of charge must be between 0 and 1');
  const chargerEfficiency = input.chargerEfficiency ?? DEFAULT_CHARGER_EFFICIENCY;
  if (!isFiniteNumber(chargerEfficiency) || chargerEfficiency <= 0 || chargerEfficiency > 1) {
    bad(fields.chargerEfficiency, chargerEfficiency, 'charger efficiency must be greater than 0 and at most 1');
  }
  const profile: ChargeProfile = { ...CHARGE_PROFILES[preset.chemistry], ...(input.chargeProfile ?? {}) };
  const pf = (name: keyof ChargeProfile) => `${fields.chargeProfile}.${name}`;
  if (!isFiniteNumber(profile.cvTransitionSoc) || profile.cvTransitionSoc <= 0 || profile.cvTransitionSoc >= 1) {
    bad(pf('cvTransitionSoc'), profile.cvTransitionSoc, 'CV transition state of charge must be between 0 and 1 (exclusive)');
  }
  if (!isFiniteNumber(profile.referenceCRate) || profile.referenceCRate <= 0) bad(pf('referenceCRate'), profile.referenceCRate, 'reference charge rate must be greater than 0 C');
  if (!isFiniteNumber(profile.terminationCRate) || profile.terminationCRate <= 0) {
    bad(pf('terminationCRate'), profile.terminationCRate, 'termination current must be greater than 0 C');
  } else if (isFiniteNumber(profile.referenceCRate) && profile.terminationCRate >= profile.referenceCRate) {
    bad(pf('terminationCRate'), profile.terminationCRate, `termination current must be below the reference charge rate (${profile.referenceCRate} C)`);
  }
  if (!isFiniteNumber(profile.chargeEfficiency) || profile.chargeEfficiency <= 0 || profile.chargeEfficiency > 1) {
    bad(pf('chargeEfficiency'), profile.chargeEfficiency, 'charge efficiency must be greater than 0 and at most 1');
  }
  const temperature = input.temperature ?? 25;
  if (!isFiniteNumber(temperature)) {
    bad(fields.temperature, temperature, 'temperature must be a number (°C)');
  } else if (temperature < preset.minChargeTemperatureC) {
    out.push(
      problem(
        'charge-too-cold',
        elementId,
        fields.temperature,
        temperature,
        isLithium(preset.chemistry)
          ? `${preset.label} must not be charged below ${preset.minChargeTemperatureC} °C (lithium plating damages the cells and can make them unsafe): warm the cells or hold the charger off with a temperature cut-out`
          : `${preset.label} must not be charged below ${preset.minChargeTemperatureC} °C`,
      ),
    );
  }
  let loadCurrent = 0;
  const nominalVoltage = (Number.isInteger(input.seriesCells) ? input.seriesCells : 0) * preset.nominalCellVoltage;
  if (input.standingLoad !== undefined) {
    const l = input.standingLoad;
    if ('current' in l) {
      if (!isFiniteNumber(l.current) || l.current < 0) bad(fields.standingLoad, l.current, 'standing load must be at least 0 A');
      else loadCurrent = l.current;
    } else if ('power' in l) {
      if (!isFiniteNumber(l.power) || l.power < 0) bad(fields.standingLoad, l.power, 'standing load must be at least 0 W');
      else if (nominalVoltage > 0) loadCurrent = l.power / nominalVoltage;
    } else {
      bad(fields.standingLoad, l, 'standing load must give a current (A) or a power (W)');
    }
  }
  if (out.length > 0) return { ok: false, problems: out };

  const C = input.capacity;
  const eta = profile.chargeEfficiency;
  const tau = (1 - profile.cvTransitionSoc) / (eta * profile.referenceCRate);
  const terminationCurrent = profile.terminationCRate * C;
  const terminationSoc = 1 - (eta * terminationCurrent * tau) / C;
  const targetSoc = input.targetSoc ?? terminationSoc;
  if (!isFiniteNumber(targetSoc) || targetSoc <= 0) {
    return { ok: false, problems: [problem('invalid-value', elementId, fields.targetSoc, targetSoc, 'target state of charge must be greater than 0')] };
  }
  if (targetSoc > terminationSoc + 1e-12) {
    return {
      ok: false,
      problems: [
        problem(
          'not-achievable',
          elementId,
          fields.targetSoc,
          targetSoc,
          `the charge terminates at ${pct(terminationSoc)} (bank current down to ${profile.terminationCRate} C); a target of ${pct(targetSoc)} is reached only on float — lower the target or the termination current`,
        ),
      ],
    };
  }
  return {
    ok: true,
    m: {
      preset,
      chargeRateSource: input.overrides?.maxChargeCRate !== undefined ? 'maker\u2019s figure, as given' : 'typical value: use the maker\u2019s figure',
      profile,
      fields,
      elementId,
      capacity: C,
      startSoc: input.startSoc,
      chargerEfficiency,
      loadCurrent,
      tau,
      maxBankCurrent: preset.maxChargeCRate * C,
      terminationCurrent,
      endSoc: targetSoc,
      chargeVoltage: input.seriesCells * preset.chargeCellVoltage,
      nominalVoltage,
    },
  };
}
