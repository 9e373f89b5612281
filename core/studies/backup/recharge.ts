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
import { problem } from './sizing-input.ts';
import { rechargeCautions } from './cautions.ts';
import { checkBase, isFiniteNumber } from './recharge-input.ts';
import {
  fmt,
  type ChargerForTimeInput,
  type ChargerOutcome,
  type Model,
  type Recharge,
  type RechargeInput,
  type RechargeOutcome,
  type RechargeStep,
} from './recharge-types.ts';

// The types, charge profiles and defaults live in recharge-types.ts, the input checks in
// recharge-input.ts; re-exported here so importers keep one entry (this file).
export {
  CHARGE_PROFILES,
  DEFAULT_CHARGER_EFFICIENCY,
  type ChargeProfile,
  type ChargerForTimeInput,
  type ChargerOutcome,
  type ChargerSizing,
  type Recharge,
  type RechargeBase,
  type RechargeFieldPaths,
  type RechargeInput,
  type RechargeOutcome,
  type RechargeStep,
  type StandingLoad,
} from './recharge-types.ts';

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

