/**
 * Recharge after an outage: time to recharge a bank from its end state of charge with a charger of
 * given DC current, while the charger also carries the standing load; and the inverse, the charger
 * current needed to recharge within a target time. Pure: no clock, no storage.
 *
 * Model (constant current, then constant voltage; a first-order acceptance model):
 * - The charger delivers at most I_ch (A, DC). The standing load I_L is served first; the bank gets
 *   I_n = min(I_ch − I_L, maximum charge C-rate × C). A charger that cannot carry the load is refused.
 * - Charge efficiency η (coulombic: Ah stored ÷ Ah put in) applies to everything the bank receives.
 * - In the constant-voltage (absorption) stage the bank accepts a current proportional to the
 *   charge it still lacks: I_acc(s) = (1 − s)·C / (η·τ), so its current decays exponentially,
 *   I(t) = I_0·e^(−t/τ), and 1 − s(t) = (1 − s_0)·e^(−t/τ).
 *   The time constant τ is set so that the chemistry's CV transition state of charge s_ref is
 *   reached at the reference charge rate I_ref (common practice per chemistry, CHARGE_PROFILES):
 *   τ = (1 − s_ref) / (η · I_ref/C)   [h].
 *   A charger of current I_n therefore changes from CC to CV at s_cv = 1 − η·I_n·τ/C (a stronger
 *   charger reaches the absorption voltage earlier, as on a real bank), which keeps the state of
 *   charge at termination the same for every charger and makes the time fall as the charger grows.
 * - Constant current: T_cc = (s_cv − s_0)·C / (η·I_n)   (closed form, constant rate).
 * - Constant voltage: from the bank current I_0 at its start to the termination current
 *   I_term = termination C-rate × C: T_cv = τ·ln(I_0 / I_term); the charge then stands at
 *   s_end = 1 − η·I_term·τ/C (the float stage completes the rest). A lower target state of charge
 *   stops earlier: T = τ·ln((1 − s_start)/(1 − s_target)) in CV.
 * - AC input of the charger: DC output power ÷ charger efficiency, with the DC voltage taken at the
 *   charge (absorption) voltage — an upper bound: the bank sits below it for most of the CC stage.
 * - A standing load given in W is converted to current at the nominal bank voltage (below the
 *   charge voltage, so the current is over- rather than under-stated).
 * Generator fuel for the recharge (AC energy × a set's specific consumption) is left for a later
 * issue; the AC input energy here is its input.
 */
import type { Chemistry, ChemistryPreset, ChemistryValues } from '../../data/battery-chemistries.ts';
import type { Problem } from '../../model/errors.ts';
import { problem, resolvePreset } from './sizing.ts';
import { isLithium, rechargeCautions } from './cautions.ts';

/** How a chemistry charges (common practice, no single source; override from the charger maker). */
export interface ChargeProfile {
  /** State of charge at which the CC stage hands over to CV when charged at `referenceCRate`, 0…1. */
  cvTransitionSoc: number;
  /** Charge rate at which `cvTransitionSoc` holds, C-rate (1/h). */
  referenceCRate: number;
  /** Bank current at which the CV stage ends, C-rate (1/h). */
  terminationCRate: number;
  /** Coulombic charge efficiency (Ah stored ÷ Ah put in), 0…1. */
  chargeEfficiency: number;
}

/**
 * Defaults per chemistry — common practice (no source):
 * lead-acid reaches its absorption voltage at about 80 % when charged at C/10 and is treated as
 * charged when the absorption current falls to 2 % of C; LiFePO4 holds CC to about 95 % at 0.5C
 * and terminates at 0.05C; NMC hands over near 80 % at 0.5C; vented NiCd about 80 % at 0.2C.
 * Coulombic efficiency: flooded 0.85, VRLA 0.90, lithium 0.99, NiCd 0.75 (NiCd makers ask for
 * 120–140 % charge input).
 */
export const CHARGE_PROFILES: Readonly<Record<Chemistry, ChargeProfile>> = {
  'flooded-lead-acid': { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.85 },
  'vrla-agm': { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.9 },
  gel: { cvTransitionSoc: 0.8, referenceCRate: 0.1, terminationCRate: 0.02, chargeEfficiency: 0.9 },
  lifepo4: { cvTransitionSoc: 0.95, referenceCRate: 0.5, terminationCRate: 0.05, chargeEfficiency: 0.99 },
  nmc: { cvTransitionSoc: 0.8, referenceCRate: 0.5, terminationCRate: 0.05, chargeEfficiency: 0.99 },
  nicd: { cvTransitionSoc: 0.8, referenceCRate: 0.2, terminationCRate: 0.02, chargeEfficiency: 0.75 },
};

/** Charger AC→DC efficiency when none is given: common practice (switch-mode chargers 0.85–0.95). */
export const DEFAULT_CHARGER_EFFICIENCY = 0.9;

/** The standing load during the recharge, at the bank: a current, or a power (W). */
export type StandingLoad = { current: number } | { power: number };

/**
 * Where each input lives in the project, for problem messages. Defaults follow the project model
 * (`bank.*` of the battery element, `backup.*` of the study); pass a map to change them.
 */
export interface RechargeFieldPaths {
  chemistry: string;
  overrides: string;
  capacity: string;
  seriesCells: string;
  startSoc: string;
  targetSoc: string;
  chargerCurrent: string;
  chargerEfficiency: string;
  chargeProfile: string;
  standingLoad: string;
  temperature: string;
  targetTime: string;
}

export interface RechargeBase {
  /** Element id used in problems: the battery's id, or "project" (default). */
  elementId?: string;
  chemistry: string;
  overrides?: Partial<ChemistryValues>;
  /** Bank rated capacity (all strings), Ah. */
  capacity: number;
  /** Cells in series (for voltages and a load given in W). */
  seriesCells: number;
  /** State of charge at the start of the recharge (the end of the outage), 0…1. */
  startSoc: number;
  /** State of charge to recharge to; default the state at which the CV stage terminates. */
  targetSoc?: number;
  /** Charger AC→DC efficiency, 0…1 (default 0.9, common practice). */
  chargerEfficiency?: number;
  /** Chemistry charge behaviour, overriding CHARGE_PROFILES. */
  chargeProfile?: Partial<ChargeProfile>;
  /** Load carried by the charger while it recharges; default none. */
  standingLoad?: StandingLoad;
  /** Cell temperature during the recharge, °C (default 25). */
  temperature?: number;
  fields?: Partial<RechargeFieldPaths>;
}

export interface RechargeInput extends RechargeBase {
  /** Charger DC output current rating, A. */
  chargerCurrent: number;
}

export interface ChargerForTimeInput extends RechargeBase {
  /** Time to recharge within, s. */
  targetTime: number;
}

export interface RechargeStep {
  label: string;
  value: number;
  unit: string;
  note: string;
}

export interface Recharge {
  /** Total time, s. */
  time: number;
  /** Constant-current stage, s. */
  constantCurrentTime: number;
  /** Constant-voltage (taper) stage, s. */
  constantVoltageTime: number;
  startSoc: number;
  /** State of charge at which CC hands over to CV for this charger (≤ start when none). */
  transitionSoc: number;
  /** State of charge reached. */
  endSoc: number;
  chargerCurrent: number;
  /** Standing-load current carried by the charger, A. */
  loadCurrent: number;
  /** Current into the bank during the CC stage, A. */
  bankCurrent: number;
  /** Bank current at the end of the CV stage, A. */
  endCurrent: number;
  /** CV time constant τ, s. */
  timeConstant: number;
  /** Charge put into the bank, Ah (before the coulombic loss). */
  chargeIn: number;
  /** Largest AC input power of the charger (CC stage, at the charge voltage), W. */
  acInputPower: number;
  /** AC energy drawn by the charger over the recharge (upper bound), Wh. */
  acInputEnergyWh: number;
  steps: RechargeStep[];
  warnings: string[];
  cautions: string[];
}

export type RechargeOutcome = { ok: true; recharge: Recharge } | { ok: false; problems: Problem[] };

export interface ChargerSizing {
  /** Smallest charger DC current that recharges within the target time, A. */
  chargerCurrent: number;
  /** The recharge with that charger. */
  recharge: Recharge;
  steps: RechargeStep[];
}

export type ChargerOutcome = { ok: true; charger: ChargerSizing } | { ok: false; problems: Problem[] };

const DEFAULT_FIELDS: RechargeFieldPaths = {
  chemistry: 'bank.chemistry',
  overrides: 'bank.overrides',
  capacity: 'bank.capacityAh',
  seriesCells: 'bank.series',
  startSoc: 'backup.startSoc',
  targetSoc: 'backup.targetSoc',
  chargerCurrent: 'backup.chargerCurrent',
  chargerEfficiency: 'backup.chargerEfficiency',
  chargeProfile: 'backup.chargeProfile',
  standingLoad: 'backup.profile',
  temperature: 'backup.temperatureC',
  targetTime: 'backup.targetRechargeHours',
};


const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** The checked model constants (hours and Ah inside; results converted to s). */
interface Model {
  preset: ChemistryPreset;
  /** The maximum charge rate in the user's words: the maker's figure as given, or a typical value. */
  chargeRateSource: string;
  profile: ChargeProfile;
  fields: RechargeFieldPaths;
  elementId: string;
  capacity: number;
  startSoc: number;
  chargerEfficiency: number;
  loadCurrent: number;
  /** τ, h. */
  tau: number;
  /** Bank current ceiling from the maximum charge C-rate, A. */
  maxBankCurrent: number;
  terminationCurrent: number;
  /** State of charge the recharge ends at. */
  endSoc: number;
  /** Charge voltage of the bank, V. */
  chargeVoltage: number;
  nominalVoltage: number;
}

function checkBase(input: RechargeBase): { ok: true; m: Model } | { ok: false; problems: Problem[] } {
  const elementId = input.elementId ?? 'project';
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

/** Time figures (h) for a net bank current I_n (A): the closed forms of the header. */
function stages(m: Model, bankCurrent: number) {
  const C = m.capacity;
  const eta = m.profile.chargeEfficiency;
  const s0 = m.startSoc;
  const sEnd = m.endSoc;
  if (s0 >= sEnd) return { tcc: 0, tcv: 0, sCv: s0, i0: 0, iEnd: 0, reached: s0 };
  // CC → CV hand-over for this current: s_cv = 1 − η·I_n·τ/C.
  const sCvCharger = 1 - (eta * bankCurrent * m.tau) / C;
  if (sEnd <= sCvCharger) {
    // The target lies inside the CC stage.
    return { tcc: ((sEnd - s0) * C) / (eta * bankCurrent), tcv: 0, sCv: sCvCharger, i0: bankCurrent, iEnd: bankCurrent, reached: sEnd };
  }
  const sStartCv = Math.max(s0, sCvCharger);
  const tcc = s0 < sCvCharger ? ((sCvCharger - s0) * C) / (eta * bankCurrent) : 0;
  // Acceptance current at the start of CV: I = (1 − s)·C/(η·τ); exponential decay to the target.
  const i0 = ((1 - sStartCv) * C) / (eta * m.tau);
  const tcv = m.tau * Math.log((1 - sStartCv) / (1 - sEnd));
  const iEnd = ((1 - sEnd) * C) / (eta * m.tau);
  return { tcc, tcv, sCv: sCvCharger, i0, iEnd, reached: sEnd };
}

function build(m: Model, chargerCurrent: number): Recharge {
  const steps: RechargeStep[] = [];
  const warnings: string[] = [];
  const step = (label: string, value: number, unit: string, note: string) => steps.push({ label, value, unit, note });
  const C = m.capacity;
  const eta = m.profile.chargeEfficiency;
  const available = chargerCurrent - m.loadCurrent;
  const bankCurrent = Math.min(available, m.maxBankCurrent);
  step('Charger current', chargerCurrent, 'A', 'DC output rating');
  step('Standing load carried by the charger', m.loadCurrent, 'A', 'served before the bank');
  step('Current into the bank (CC)', bankCurrent, 'A', bankCurrent < available ? `held at the maximum charge rate ${m.preset.maxChargeCRate} C (${m.chargeRateSource})` : 'charger − load');
  if (bankCurrent < available) {
    warnings.push(
      `The charger could give the bank ${fmt(available)} A, above its maximum charge rate (${m.preset.maxChargeCRate} C = ${fmt(m.maxBankCurrent)} A, ${m.chargeRateSource}): set the charger's current limit (or the battery management system will).`,
    );
  }
  step('Charge efficiency', eta, '', 'Ah stored ÷ Ah put in (typical value per chemistry: use the maker\u2019s figure)');
  step('CV time constant τ', m.tau * 3600, 's', `(1 − ${m.profile.cvTransitionSoc}) ÷ (η × ${m.profile.referenceCRate} C)`);
  const st = stages(m, bankCurrent);
  step('Start state of charge', m.startSoc, '', '');
  step('CC → CV transition state of charge', st.sCv, '', `1 − η·I·τ/C for this charger (${m.profile.cvTransitionSoc} at ${m.profile.referenceCRate} C: typical values per chemistry, use the maker\u2019s figures)`);
  step('Constant-current stage', st.tcc * 3600, 's', '(s_cv − s_0)·C ÷ (η·I)');
  step('Constant-voltage stage', st.tcv * 3600, 's', 'τ·ln((1 − s_cv)/(1 − s_end)): exponential taper');
  step('End state of charge', st.reached, '', m.endSoc < 1 ? `CV ends at ${fmt(st.iEnd)} A (${m.profile.terminationCRate} C termination, typical value: use the maker\u2019s figure; or the target given)` : '');
  if (m.startSoc >= m.endSoc) warnings.push('The bank already stands at or above the end state of charge: no recharge is needed.');
  if (bankCurrent <= m.terminationCurrent && m.startSoc < m.endSoc) {
    warnings.push(
      `The current left for the bank (${fmt(bankCurrent)} A) is no more than the termination current (${fmt(m.terminationCurrent)} A): the charger is far too small for this bank.`,
    );
  }
  // Charge put in: CC at I_n, then ∫ I dt over the exponential taper = τ·(I_0 − I_end).
  const chargeIn = bankCurrent * st.tcc + (st.tcv > 0 ? m.tau * (st.i0 - st.iEnd) : 0);
  const time = (st.tcc + st.tcv) * 3600;
  const dcEnergyWh = m.chargeVoltage * (chargeIn + m.loadCurrent * (st.tcc + st.tcv));
  const acInputPower = (m.chargeVoltage * (bankCurrent + m.loadCurrent)) / m.chargerEfficiency;
  const acInputEnergyWh = dcEnergyWh / m.chargerEfficiency;
  step('Total recharge time', time, 's', 'CC + CV');
  step('Charge put into the bank', chargeIn, 'Ah', `${fmt(C)} Ah bank`);
  step('Largest AC input power', acInputPower, 'W', `${fmt(m.chargeVoltage)} V charge voltage × ${fmt(bankCurrent + m.loadCurrent)} A ÷ ${m.chargerEfficiency} charger efficiency`);
  step('AC input energy', acInputEnergyWh, 'Wh', 'upper bound (DC taken at the charge voltage); input for generator fuel (later)');
  return {
    time,
    constantCurrentTime: st.tcc * 3600,
    constantVoltageTime: st.tcv * 3600,
    startSoc: m.startSoc,
    transitionSoc: st.sCv,
    endSoc: st.reached,
    chargerCurrent,
    loadCurrent: m.loadCurrent,
    bankCurrent,
    endCurrent: st.iEnd,
    timeConstant: m.tau * 3600,
    chargeIn,
    acInputPower,
    acInputEnergyWh,
    steps,
    warnings,
    cautions: rechargeCautions(m.preset.chemistry),
  };
}

/** Time to recharge with a charger of given DC current (see header for the model). */
export function rechargeTime(input: RechargeInput): RechargeOutcome {
  const checked = checkBase(input);
  if (!checked.ok) return checked;
  const m = checked.m;
  const I = input.chargerCurrent;
  if (!isFiniteNumber(I) || I <= 0) {
    return { ok: false, problems: [problem('invalid-value', m.elementId, m.fields.chargerCurrent, I, 'charger current must be greater than 0 A')] };
  }
  if (I <= m.loadCurrent) {
    return {
      ok: false,
      problems: [
        problem(
          'charger-too-small',
          m.elementId,
          m.fields.chargerCurrent,
          I,
          `the charger (${fmt(I)} A) cannot even carry the standing load (${fmt(m.loadCurrent)} A): the bank would keep discharging — a charger above ${fmt(m.loadCurrent)} A is needed`,
        ),
      ],
    };
  }
  return { ok: true, recharge: build(m, I) };
}

/**
 * The smallest charger DC current that recharges within `targetTime`: bisection on the bank
 * current (the recharge time never rises with it), to 1e-10 relative.
 */
export function chargerForTargetTime(input: ChargerForTimeInput): ChargerOutcome {
  const checked = checkBase(input);
  if (!checked.ok) return checked;
  const m = checked.m;
  const target = input.targetTime;
  if (!isFiniteNumber(target) || target <= 0) {
    return { ok: false, problems: [problem('invalid-value', m.elementId, m.fields.targetTime, target, 'target recharge time must be greater than 0 s')] };
  }
  const hours = (bankCurrent: number) => {
    const st = stages(m, bankCurrent);
    return st.tcc + st.tcv;
  };
  const targetH = target / 3600;
  const steps: RechargeStep[] = [];
  if (m.startSoc >= m.endSoc) {
    // Nothing to recharge: the charger need only carry the load; give it the termination current too.
    const current = m.loadCurrent + m.terminationCurrent;
    steps.push({ label: 'Charger current', value: current, unit: 'A', note: 'bank already charged: standing load + termination current' });
    return { ok: true, charger: { chargerCurrent: current, recharge: build(m, current), steps } };
  }
  const fastest = hours(m.maxBankCurrent);
  if (fastest > targetH) {
    return {
      ok: false,
      problems: [
        problem(
          'not-achievable',
          m.elementId,
          m.fields.targetTime,
          target,
          `no charger can recharge this bank within ${fmt(targetH)} h: even at its maximum charge rate (${m.preset.maxChargeCRate} C = ${fmt(m.maxBankCurrent)} A, ${m.chargeRateSource}) it takes ${fmt(fastest)} h, the taper of the constant-voltage stage included`,
        ),
      ],
    };
  }
  // Bracket: T(lo) > target ≥ T(hi). T → ∞ as the bank current → 0.
  let hi = m.maxBankCurrent;
  let lo = hi;
  while (hours(lo) <= targetH && lo > 1e-12 * hi) lo /= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-10 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (hours(mid) <= targetH) hi = mid;
    else lo = mid;
  }
  const current = hi + m.loadCurrent;
  steps.push({ label: 'Target recharge time', value: target, unit: 's', note: '' });
  steps.push({ label: 'Current into the bank needed', value: hi, unit: 'A', note: 'bisection on the CC-CV recharge time' });
  steps.push({ label: 'Standing load carried by the charger', value: m.loadCurrent, unit: 'A', note: '' });
  steps.push({ label: 'Charger current', value: current, unit: 'A', note: 'bank + standing load' });
  return { ok: true, charger: { chargerCurrent: current, recharge: build(m, current), steps } };
}

/** For messages only. */
function fmt(x: number): string {
  return String(Number(x.toPrecision(4)));
}
function pct(x: number): string {
  return `${fmt(100 * x)} %`;
}
