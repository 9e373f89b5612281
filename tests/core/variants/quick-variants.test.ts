import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../../core/demos/index.ts';
import { solveProjectVariant } from '../../../core/solve/project-variant.ts';
import { criticalLoadsVariant, nextSizeUpVariant, seriesForSystem, systemVoltageVariant } from '../../../core/variants/index.ts';
import { MADE_FOR_VOLTAGE } from '../../../core/variants/system-voltage.ts';
import type { Project } from '../../../core/model/project.ts';
import { dcProject, solved } from './fixtures.ts';

const demo = (id: string): Project => demoProjects.find((d) => d.id === id)!.project;
const current = (s: ReturnType<typeof solved>, id: string) => s.result.elements.find((e) => e.id === id)!.output!.current;

describe('system voltage variant (12 / 24 / 48 V)', () => {
  it('cells in series per string from the chemistry: 12 V = 6 lead-acid cells, 4 LiFePO4 cells, 10 NiCd cells, 1 lead-acid 12 V block; 24 and 48 V two and four times that', () => {
    // common practice (no source): the usual series counts of 12/24/48 V banks.
    expect([12, 24, 48].map((v) => seriesForSystem(2.0, v))).toEqual([6, 12, 24]);
    expect([12, 24, 48].map((v) => seriesForSystem(3.2, v))).toEqual([4, 8, 16]);
    expect([12, 24, 48].map((v) => seriesForSystem(1.2, v))).toEqual([10, 20, 40]);
    expect([12, 24, 48].map((v) => seriesForSystem(12, v))).toEqual([1, 2, 4]);
  });

  it('24 → 48 V halves the DC current at the same power (P = V·I, hand-worked)', () => {
    const base = solved(dcProject());
    const v = systemVoltageVariant(base.project, 48);
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    // 8 cells → 16 cells; the same 8 cells cannot make two 16-cell strings, so the string stays (note says the energy changes).
    expect(v.variant.set?.['bank']?.['bank']).toMatchObject({ series: 16, strings: 1 });
    expect(v.variant.note).toMatch(/stored energy changes/);
    const s48 = solveProjectVariant(base, v.variant);
    expect(s48.ok).toBe(true);
    if (!s48.ok) return;
    // Hand-worked: R = 0, full bank: V = 8 × 3.40 V = 27.2 V (LiFePO4 open-circuit voltage at full charge, the preset's
    // curve, core/data/battery-chemistries.ts: typical value); I = P / V = 1200 / 27.2 = 44.12 A; at 48 V: 16 × 3.40 = 54.4 V, 22.06 A.
    expect(current(base, 'bank')).toBeCloseTo(1200 / 27.2, 6);
    expect(current(s48, 'bank')).toBeCloseTo(1200 / 54.4, 6);
    expect(current(s48, 'bank') / current(base, 'bank')).toBeCloseTo(0.5, 9); // P = V·I: double the voltage, half the current
  });

  it('the cable is sized again for the new current: 10 mm² at 24 V, 2.5 mm² at 48 V (IEC 60364-5-52 Table B.52.2, PVC, method C, 2 loaded Cu)', () => {
    const base = solved(dcProject({ cable: true }));
    const v = systemVoltageVariant(base.project, 48);
    if (!v.ok) throw new Error('refused');
    const s48 = solveProjectVariant(base, v.variant);
    if (!s48.ok) throw new Error(JSON.stringify(s48.problems));
    const size = (s: typeof base) => s.result.elements.find((e) => e.id === 'feed')!.conductor!;
    // 24 V: design current 1200 W / 25.6 V nominal = 46.9 A; B.52.2 C: 6 mm² carries 46 A (too little), 10 mm² 63 A.
    expect(size(base).designCurrent).toBeCloseTo(1200 / 25.6, 6); // load at the nominal voltage (IEC 60364 I_B), 8 × 3.2 V
    expect(size(base).size).toBe('10 mm²');
    // 48 V: 1200 / 51.2 = 23.4 A; B.52.2 C: 1.5 mm² carries 19.5 A (too little), 2.5 mm² 27 A; the device the next
    // IEC 60898-1 preferred rating at or above 23.4 A, 25 A (I_B ≤ I_n ≤ I_z: 23.4 ≤ 25 ≤ 27).
    expect(size(s48).designCurrent).toBeCloseTo(1200 / 51.2, 6);
    expect(size(s48).size).toBe('2.5 mm²');
    expect(size(s48).governing).toBe('ampacity');
    expect(size(s48).device.rating).toBe(25);
    expect(v.variant.note).toContain('cables sized again for the new currents: Bank feed'); // an "auto" cable: nothing to set (common practice (no source))
    expect(v.variant.set).not.toHaveProperty('feed');
  });

  it('voltages of the DC system follow: the inverter\'s low-voltage cut-off scales with the bank (21 V at 24 V → 42 V at 48 V)', () => {
    const base = solved(dcProject({ withInverter: true }));
    const v = systemVoltageVariant(base.project, 48);
    if (!v.ok) throw new Error('refused');
    expect(v.variant.set?.['inv']).toEqual({ lowVoltageCutoff: 42 }); // 21 V × 16/8 (same cells, k = n_new/n_old)
    expect(solveProjectVariant(base, v.variant).ok).toBe(true);
  });

  it('keeps the cells where it can: the hillside bank, 16 × 200 Ah LiFePO4 at 48 V, becomes 8 in series × 2 strings at 24 V', () => {
    const v = systemVoltageVariant(demo('hillside-relay-hut'), 24);
    if (!v.ok) throw new Error('refused');
    // 16 cells = 8 × 2, by hand; only what changes is stored (the capacity stays the plan's: common practice (no source)).
    expect(v.variant.set?.['bank']?.['bank']).toEqual({ series: 8, strings: 2 });
    expect(v.variant.set?.['inverter']).toEqual({ lowVoltageCutoff: 22 }); // 44 V × 8/16
    expect(v.variant.note).toMatch(/same stored energy/);
    // Its bank cable is given by its resistance: named, not sized (common practice (no source)).
    expect(v.variant.note).toContain('Bank to bus, 35 mm² Cu: given by its resistance, not sized again: check it at the new current');
    expect(v.variant.set).not.toHaveProperty('bank-cable');
    expect(v.variant.note).not.toMatch(/cables sized again/);
    // 2 strings: no caution on strings in parallel (at most 4, core/studies/backup/sizing-types.ts DEFAULT_MAX_STRINGS, common practice).
    expect(v.variant.note).not.toMatch(/strings in parallel share/);
  });

  it('a DC cable with a fixed size is sized again: its size set to "auto" in the variant, 10 mm² at 24 V → 2.5 mm² at 48 V (IEC 60364-5-52 Table B.52.2, PVC, method C, 2 loaded Cu)', () => {
    const plan = dcProject({ cable: true });
    const feed = plan.elements.find((e) => e.id === 'feed') as unknown as { conductor: { size: string } };
    feed.conductor.size = '10 mm²';
    const base = solved(plan);
    const v = systemVoltageVariant(base.project, 48);
    if (!v.ok) throw new Error('refused');
    expect(v.variant.set?.['feed']).toEqual({ conductor: { size: 'auto' } });
    expect(v.variant.note).toContain('cables sized again for the new currents: Bank feed (10 mm² in the plan)');
    const s48 = solveProjectVariant(base, v.variant);
    if (!s48.ok) throw new Error(JSON.stringify(s48.problems));
    const c = s48.result.elements.find((e) => e.id === 'feed')!.conductor!;
    // 1200 W / 51.2 V = 23.4 A; B.52.2 C: 1.5 mm² 19.5 A (too little), 2.5 mm² 27 A (hand-worked as the test above).
    expect(c.designCurrent).toBeCloseTo(1200 / 51.2, 6);
    expect(c.size).toBe('2.5 mm²');
  });

  it('with resizeCables false (the option search, whose sizes are an axis of their own) a fixed size is kept and named to be checked', () => {
    const plan = dcProject({ cable: true });
    (plan.elements.find((e) => e.id === 'feed') as unknown as { conductor: { size: string } }).conductor.size = '10 mm²';
    const v = systemVoltageVariant(plan, 48, { resizeCables: false });
    if (!v.ok) throw new Error('refused');
    expect(v.variant.set).not.toHaveProperty('feed'); // common practice (no source): the user's size stays
    expect(v.variant.note).toContain('Bank feed: kept at 10 mm², not sized again: check it at the new current');
  });

  it('a DC cable whose design current is given is sized for that current: the note says to check it at the new voltage', () => {
    const plan = dcProject({ cable: true });
    const feed = plan.elements.find((e) => e.id === 'feed') as unknown as { conductor: Record<string, unknown> };
    feed.conductor['designCurrentBasis'] = 'given';
    feed.conductor['designCurrent'] = 50;
    const v = systemVoltageVariant(solved(plan).project, 48);
    if (!v.ok) throw new Error('refused');
    expect(v.variant.note).toContain('Bank feed: its design current is given (50 A), so it is sized again for that current: check it at the new voltage');
    expect(v.variant.note).not.toMatch(/cables sized again/); // common practice (no source): a given current is the user's
  });

  it('cautions: the equipment on the DC system must be made for the new voltage; more than 4 strings in parallel ask for the maker’s limit (harbour clinic at 12 V: 16 strings)', () => {
    const v = systemVoltageVariant(demo('harbour-clinic-ups'), 12);
    if (!v.ok) throw new Error('refused');
    // 16 blocks of 12 V → 1 in series × 16 strings, by hand.
    expect(v.variant.set?.['bank']?.['bank']).toEqual({ series: 1, strings: 16 });
    // Makers limit the strings in parallel: typical value 4 (core/studies/backup/sizing-types.ts DEFAULT_MAX_STRINGS, common practice (no source)).
    expect(v.variant.note).toContain('16 strings in parallel share the current unevenly, and makers limit how many strings may be put in parallel (typical value 4: use the maker’s figure)');
    // The search's wording (core/studies/search/search.ts): "check that each is made for that voltage, or list alternatives with their makers’ figures".
    expect(v.variant.note).toContain(`the equipment on the DC system is the same, now at 12 V DC (UPS inverter, UPS rectifier): ${MADE_FOR_VOLTAGE}`);
    expect(MADE_FOR_VOLTAGE).toBe('check that each is made for that voltage, or list alternatives with their makers’ figures');
    expect(v.variant.note).toContain('Bus to battery cabinet, 25 mm² Cu: given by its resistance, not sized again: check it at the new current');
    const at48 = systemVoltageVariant(demo('harbour-clinic-ups'), 48);
    if (!at48.ok) throw new Error('refused');
    expect(at48.variant.note).not.toMatch(/strings in parallel share/); // 4 strings: within the typical 4 (common practice (no source))
  });

  it('refuses with a message when the chain has no DC system bank, or is already at that voltage', () => {
    const none = systemVoltageVariant(demo('riverside-pump-station'), 48);
    expect(none.ok).toBe(false);
    if (!none.ok) expect(none.problems[0]!.message).toMatch(/no DC system with a battery bank/);
    const same = systemVoltageVariant(demo('hillside-relay-hut'), 48);
    expect(same.ok).toBe(false);
    if (!same.ok) expect(same.problems[0]!.message).toMatch(/already a 48 V bank/);
    const bare = systemVoltageVariant({ elements: [{ id: 'b', name: 'Bare bank', kind: 'battery', voltage: 24 }] } as unknown as Project, 48);
    expect(bare.ok).toBe(false);
    if (!bare.ok) expect(bare.problems[0]!.message).toMatch(/"Bare bank" is given by its voltage alone/);
  });
});

describe('critical loads against the whole site', () => {
  it('takes the loads marked not critical out: the source then carries only the rest (Σ loads, hand-worked)', () => {
    const base = solved(dcProject({ withInverter: true }));
    const v = criticalLoadsVariant(base.project, ['inv']);
    if (!v.ok) throw new Error('refused');
    expect(v.variant.remove).toEqual(['inv', 'tv']); // the inverter's branch whole
    const s = solveProjectVariant(base, v.variant);
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    expect(s.result.totals.loadPower).toBeCloseTo(1200, 9); // only the 1200 W load is left: common practice (no source)
  });
  it('refuses the source, an unknown id, nothing picked, or every load', () => {
    const p = dcProject();
    expect(criticalLoadsVariant(p, ['bank']).ok).toBe(false);
    expect(criticalLoadsVariant(p, ['nope']).ok).toBe(false);
    expect(criticalLoadsVariant(p, []).ok).toBe(false);
    const all = criticalLoadsVariant(p, ['bus']);
    expect(all.ok).toBe(false);
    if (!all.ok) expect(all.problems[0]!.message).toMatch(/keep at least one critical load/);
  });
});

describe('the next conductor size up', () => {
  it('steps the cold store\'s controls run from 10 to 16 mm² (IEC 60228 class 2 size series), and the drop falls as 1/A', () => {
    const base = solved(demo('cold-store-dc-bus'));
    const v = nextSizeUpVariant(base, 'ctl-cable');
    if (!v.ok) throw new Error(JSON.stringify(v.problems));
    expect(base.result.elements.find((e) => e.id === 'ctl-cable')!.conductor!.size).toBe('10 mm²');
    expect(v.variant.set?.['ctl-cable']).toEqual({ conductor: { size: '16 mm²' } }); // IEC 60228: 10, 16, 25 mm²; only the size stored
    const s = solveProjectVariant(base, v.variant);
    if (!s.ok) throw new Error(JSON.stringify(s.problems));
    const c0 = base.result.elements.find((e) => e.id === 'ctl-cable')!;
    const c1 = s.result.elements.find((e) => e.id === 'ctl-cable')!;
    expect(c1.conductor!.size).toBe('16 mm²');
    // The drop is I·R: at the same current it scales with the conductor's resistance, IEC 60228 Table 1 class 2 plain
    // copper: 10 mm² 1.83 Ω/km, 16 mm² 1.15 Ω/km (ratio 0.628; the runs' temperatures differ a little).
    const ratio = (c1.conductor!.drop.checkPercent / c0.conductor!.drop.checkPercent) / (c1.input!.current / c0.input!.current);
    expect(ratio).toBeCloseTo(1.15 / 1.83, 2);
  });
  it('all cables: the cables given by their resistance are named as left alone; one such cable alone is refused', () => {
    const base = solved(demo('harbour-clinic-ups'));
    const all = nextSizeUpVariant(base, null);
    if (!all.ok) throw new Error('refused');
    expect(Object.keys(all.variant.set ?? {})).toEqual(['supply-cable']);
    expect(all.variant.note).toMatch(/left as they are.*Bus to battery cabinet/);
    const one = nextSizeUpVariant(base, 'bank-cable');
    expect(one.ok).toBe(false);
    if (!one.ok) expect(one.problems[0]!.message).toMatch(/given by its resistance/);
  });
});
