/** IEC 60898-1 preferred rated currents and instantaneous-trip ranges. */
import { describe, expect, it } from 'vitest';
import { IEC_60898_1_INSTANTANEOUS_TRIP, IEC_60898_1_MAX_RATED_CURRENT_A, IEC_60898_1_RATED_CURRENTS } from '../../core/data/iec-60898-1.ts';

const ratings = IEC_60898_1_RATED_CURRENTS.map((r) => r.ratedCurrentA);

describe('IEC 60898-1 preferred rated currents', () => {
  it('lists 6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125 A (IEC 60898-1:2015 5.3.2, published copy)', () => {
    const confirmed = IEC_60898_1_RATED_CURRENTS.filter((r) => r.provenance === 'confirmed').map((r) => r.ratedCurrentA);
    expect(confirmed).toEqual([6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125]);
  });

  it('carries 8 A from memory (IEC 60898-1 clause 5.3.2, not yet checked)', () => {
    expect(IEC_60898_1_RATED_CURRENTS.find((r) => r.ratedCurrentA === 8)?.provenance).toBe('from memory');
  });

  it('is sorted, unique, and within the 125 A scope (IEC 60898-1:2015 scope)', () => {
    for (let i = 1; i < ratings.length; i++) expect(ratings[i]!).toBeGreaterThan(ratings[i - 1]!);
    expect(ratings.at(-1)).toBe(IEC_60898_1_MAX_RATED_CURRENT_A);
    expect(IEC_60898_1_MAX_RATED_CURRENT_A).toBe(125);
  });
});

describe('IEC 60898-1 instantaneous-trip ranges', () => {
  it.each([
    ['B', 3, 5, 'IEC 60898-1 type B: 3–5 × In'],
    ['C', 5, 10, 'IEC 60898-1 type C: 5–10 × In'],
    ['D', 10, 20, 'IEC 60898-1 type D: 10–20 × In'],
  ] as const)('type %s trips instantly between %d and %d × In (%s)', (type, from, to, _source) => {
    const r = IEC_60898_1_INSTANTANEOUS_TRIP.find((x) => x.type === type)!;
    expect([r.fromMultiple, r.toMultiple]).toEqual([from, to]);
  });

  it('ranges adjoin without overlap, B below C below D', () => {
    for (let i = 1; i < IEC_60898_1_INSTANTANEOUS_TRIP.length; i++) {
      expect(IEC_60898_1_INSTANTANEOUS_TRIP[i]!.fromMultiple).toBe(IEC_60898_1_INSTANTANEOUS_TRIP[i - 1]!.toMultiple);
    }
  });
});
