/**
 * The page's cost over the years (web/components/cost/): the panel worker's machines reply carries
 * core's lifetimeCost for the project, and the section's rows (lifetime-rows.ts) show exactly core's
 * figures, each also checked against the case worked by hand beside it.
 *
 * The chain (as in tests/core/lifetime.test.ts): a stiff 230 V supply, a rectifier of constant 90 %
 * efficiency, a 900 W DC load: the rectifier takes 900 / 0.9 = 1000 W and loses 100 W (P_in = P_out / η).
 */
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/solve/index.ts';
import { lifetimeCost } from '../../core/studies/lifetime.ts';
import { lifetimeRows, rowText } from '../../web/components/cost/lifetime-rows.ts';
import { KIND_FORMS, type NumberSpec } from '../../web/editor/fields.ts';

const project = (running: Record<string, unknown>) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Lifetime on the page',
  elements: [
    { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'psu', name: 'Power supply', kind: 'rectifier', from: 'src', outputVoltage: 48, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 }, price: 400 },
    { id: 'lamp', name: 'Lamps', kind: 'dc-load', from: 'psu', power: 900, price: 100 },
  ],
  running,
});

type Reply = { id: number; reply: { kind: string; outcome: { ok: boolean; figures?: { lifetime?: unknown } } } };
const scope = globalThis as unknown as { onmessage: ((e: { data: unknown }) => void) | null; postMessage: (m: Reply) => void };

async function askMachines(solved: unknown): Promise<Reply['reply']> {
  const replies: Reply[] = [];
  scope.postMessage = (m) => replies.push(m);
  await import('../../web/components/panel-worker.ts');
  scope.onmessage!({ data: { id: 1, request: { kind: 'machines', solved, cost: null } } });
  return replies[0]!.reply;
}

const RUNNING = { energyPricePerKWh: 0.3, nightPricePerKWh: 0.1, hoursPerYear: 8760, years: 10, discountRate: 0.05, gridCo2KgPerKWh: 0.4 };

describe('cost over the years on the page', () => {
  it('the worker hands back core’s lifetimeCost, and each row shows core’s figure', async () => {
    const s = solveProject(project(RUNNING));
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const core = lifetimeCost(s);
    if (!core.ok) throw new Error(JSON.stringify(core.problems));
    const reply = await askMachines(s);
    expect(reply.outcome.ok).toBe(true);
    expect(reply.outcome.figures?.lifetime).toEqual(core);
    const rows = new Map(lifetimeRows(core.cost).map((r) => [r.key, r]));
    expect(rows.get('price')!.value).toBe(core.cost.pricePerKWh);
    expect(rows.get('energy')!.value).toBe(core.cost.losses.totalEnergyKWh);
    expect(rows.get('loss-cost')!.value).toBe(core.cost.losses.totalCost);
    expect(rows.get('yearly')!.value).toBe(core.cost.yearlyCost);
    expect(rows.get('purchase')!.value).toBe(core.cost.purchase);
    expect(rows.get('npv')!.value).toBe(core.cost.npv);
    expect(rows.get('co2-year')!.value).toBe(core.cost.co2KgPerYear);
    // By hand (common practice (no source): time-weighted mean price; end-of-year present worth):
    // mean price (16 × 0.30 + 8 × 0.10) / 24 = 5.6 / 24 = 0.23333 per kWh; 100 W × 8760 h = 876 kWh;
    // 876 × 0.23333 = 204.40 a year; purchase 400 + 100 = 500;
    // NPV = 500 + 204.40 × (1 − 1.05⁻¹⁰) / 0.05 = 500 + 204.40 × 7.721735 = 2078.32;
    // CO₂ 876 × 0.4 = 350.4 kg a year, × 10 years = 3504 kg.
    expect(rows.get('price')!.value).toBeCloseTo(0.233333, 5);
    expect(rows.get('energy')!.value).toBeCloseTo(876, 6);
    expect(rows.get('loss-cost')!.value).toBeCloseTo(204.4, 6);
    expect(rows.get('purchase')!.value).toBe(500);
    expect(rows.get('npv')!.value).toBeCloseTo(2078.32, 2);
    expect(rows.get('co2-year')!.value).toBeCloseTo(350.4, 6);
    expect(rows.get('co2-years')!.value).toBeCloseTo(3504, 6);
    // The formula is named in the working, and the money is written in the user's currency.
    expect(rows.get('npv')!.how).toMatch(/net present value at 5 % a year: purchase \+ Σ yearly cost ÷ \(1 \+ r\)\^t, t = 1…10/);
    expect(rowText(rows.get('npv')!, 'en-US')).toBe('$2,078.32');
    expect(rowText(rows.get('co2-years')!, 'en-US')).toBe('3,504\u202fkg');
    // The client report asks for the cost over the years alone: the same figures.
    const replies: Reply[] = [];
    scope.postMessage = (m) => replies.push(m);
    scope.onmessage!({ data: { id: 2, request: { kind: 'lifetime', solved: s } } });
    expect((replies[0]!.reply as unknown as { outcome: unknown }).outcome).toEqual(core);
  });

  it('a generator’s fuel is a row, and no lifetime figures come without the years of service', async () => {
    // The 20 kW row of the suppliers' chart (core/data/diesel-fuel-typical.ts, common practice): 0.6, 0.9, 1.6 gal/h;
    // 1 US gal = 3.785411784 L (NIST SP 811, B.8). The supply's 1000 W is 5 % of 20 kW: below ¼, the ¼–½ line
    // extended: 0.6 + (0.9 − 0.6) × (0.05 − 0.25) / 0.25 = 0.36 gal/h = 1.3627 L/h; × 100 h = 136.27 L a year.
    const GAL = 3.785411784;
    const generator = { quarterLoadLitresPerHour: 0.6 * GAL, halfLoadLitresPerHour: 0.9 * GAL, fullLoadLitresPerHour: 1.6 * GAL, ratedPower: 20000, outageHoursPerYear: 100, fuelPricePerLitre: 1.5 };
    const s = solveProject(project({ ...RUNNING, generator }));
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const core = lifetimeCost(s);
    if (!core.ok) throw new Error(JSON.stringify(core.problems));
    const rows = new Map(lifetimeRows(core.cost).map((r) => [r.key, r]));
    expect(rows.get('fuel')!.value).toBe(core.cost.generator!.litresPerYear);
    expect(rows.get('fuel')!.value).toBeCloseTo(0.36 * GAL * 100, 6);
    expect(rows.get('fuel-cost')!.value).toBeCloseTo(0.36 * GAL * 100 * 1.5, 6);
    expect(rows.get('yearly')!.value).toBeCloseTo(204.4 + 0.36 * GAL * 150, 6);

    const { years: _y, ...noYears } = RUNNING;
    const t = solveProject(project(noYears));
    if (!t.ok) throw new Error(JSON.stringify(t.problems));
    const reply = await askMachines(t);
    expect(reply.outcome.ok).toBe(true);
    expect(reply.outcome.figures?.lifetime).toBeUndefined();
  });
});

describe('the working of the mean price', () => {
  it('names the load profile when the split is read from it', () => {
    // Lamps on 20:00–06:00, the day price 7–23 h: 3 h of their 10 by day, s = 0.3 (tests/core/lifetime-profile.test.ts works it by hand).
    const backup = { profile: { kind: 'daily', segments: [{ startHour: 0, loads: { lamp: true } }, { startHour: 6, loads: { lamp: false } }, { startHour: 20, loads: { lamp: true } }] } };
    const s = solveProject({ ...project({ ...RUNNING, dayHoursFromProfile: true }), backup });
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const c = lifetimeCost(s);
    if (!c.ok) throw new Error(JSON.stringify(c.problems));
    const price = lifetimeRows(c.cost).find((r) => r.key === 'price')!;
    expect(price.value).toBeCloseTo(0.3 * 0.3 + 0.7 * 0.1, 12);
    expect(price.how).toBe("energy-weighted mean price: the load profile's day uses the day price for 30 % of its energy (7.2 h of 24 in the mean)");
  });
});

describe('the purchase price on every element’s form', () => {
  it('is the last field of every kind’s form, in the currency of the user’s number format', () => {
    for (const [kind, form] of Object.entries(KIND_FORMS)) {
      const last = form.fields[form.fields.length - 1] as NumberSpec;
      expect(last.path, kind).toBe('price');
      expect(last.label).toBe('Purchase price');
      expect(last.required).toBe(false);
    }
    const price = KIND_FORMS.rectifier.fields.at(-1) as NumberSpec;
    // The locales' currencies (ISO 4217, as Intl writes them): US dollar, euro.
    expect(price.unitText?.('en-US')).toBe('$');
    expect(price.unitText?.('de-DE')).toBe('€');
  });
});
