/**
 * The cost over the years as the page shows it: core's lifetimeCost (core/studies/lifetime.ts) turned into
 * the section's rows, each with the figure core gave (never worked out again here) and the method in words.
 * Pure, so a Node test holds each row against core's figure on the same project.
 */
import type { LifetimeCost } from '../../../core/studies/index.ts';
import { formatEnergy, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { currencySymbol, formatMoney } from '../../format/panels.ts';

export type RowUnit = 'money' | 'money-per-kWh' | 'kWh' | 'kg' | 'L';

export interface LifetimeRow {
  /** The row's key (its `data-testid` is `lifetime-<key>`). */
  key: 'price' | 'energy' | 'loss-cost' | 'fuel' | 'fuel-cost' | 'yearly' | 'purchase' | 'npv' | 'co2-year' | 'co2-years';
  label: string;
  value: number;
  unit: RowUnit;
  /** How the figure is worked out, in words (the method named). */
  how: string;
}

/** The rows of the cost over the years, in the order a reader follows them: price, a year's losses, the purchase, the lifetime. */
export function lifetimeRows(c: LifetimeCost): LifetimeRow[] {
  const rows: LifetimeRow[] = [];
  const pct = (r: number) => `${Number((r * 100).toPrecision(3))} %`;
  rows.push({
    key: 'price',
    label: 'Mean price per kWh',
    value: c.pricePerKWh,
    unit: 'money-per-kWh',
    how:
      c.dayHoursFrom === 'load profile'
        ? `energy-weighted mean price: the load profile's day uses the day price for ${Number(((c.dayHours / 24) * 100).toPrecision(3))} % of its energy (${Number(c.dayHours.toPrecision(3))} h of 24 in the mean)`
        : c.dayHours < 24
          ? `time-weighted mean price: (day hours × day price + night hours × night price) ÷ 24, with ${Number(c.dayHours.toPrecision(4))} h at the day price`
          : 'one price all day',
  });
  rows.push({ key: 'energy', label: 'Energy lost a year', value: c.losses.totalEnergyKWh, unit: 'kWh', how: `the losses at the operating point × ${Number(c.hoursPerYear.toPrecision(5))} h a year` });
  rows.push({ key: 'loss-cost', label: 'Cost of the losses a year', value: c.losses.totalCost, unit: 'money', how: 'energy lost × mean price' });
  if (c.generator) {
    rows.push({ key: 'fuel', label: 'Generator fuel a year', value: c.generator.litresPerYear, unit: 'L', how: 'fuel table interpolated linearly between ¼, ½ and full load, × the hours it runs' });
    if (c.generator.fuelCostPerYear !== undefined) rows.push({ key: 'fuel-cost', label: 'Cost of the fuel a year', value: c.generator.fuelCostPerYear, unit: 'money', how: 'fuel × its price per litre' });
  }
  rows.push({ key: 'yearly', label: 'Yearly cost counted', value: c.yearlyCost, unit: 'money', how: c.generator?.fuelCostPerYear !== undefined ? 'losses + fuel' : 'the losses' });
  rows.push({ key: 'purchase', label: 'Purchase', value: c.purchase, unit: 'money', how: c.priced.length ? `the sum of the purchase prices of ${c.priced.length} of ${c.priced.length + c.unpriced.length} elements` : 'no element has a purchase price yet' });
  rows.push({
    key: 'npv',
    label: `Lifetime cost over ${c.years} year${c.years === 1 ? '' : 's'}`,
    value: c.npv,
    unit: 'money',
    how: `net present value at ${pct(c.discountRate)} a year: purchase + Σ yearly cost ÷ (1 + r)^t, t = 1…${c.years}; not counted: replacing parts that wear out (a battery bank, for one), maintenance, price rises`,
  });
  if (c.co2KgPerYear !== undefined) {
    rows.push({ key: 'co2-year', label: 'CO₂ of the losses a year', value: c.co2KgPerYear, unit: 'kg', how: 'energy lost × the grid factor you entered' });
    rows.push({ key: 'co2-years', label: `CO₂ of the losses over ${c.years} year${c.years === 1 ? '' : 's'}`, value: c.co2KgPerYear * c.years, unit: 'kg', how: 'a year’s CO₂ × the years of service (not discounted)' });
  }
  return rows;
}

/** A row's figure in the user's number format and currency. */
export function rowText(row: Pick<LifetimeRow, 'value' | 'unit'>, locale?: string): string {
  switch (row.unit) {
    case 'money':
      return formatMoney(row.value, locale);
    case 'money-per-kWh': {
      const symbol = currencySymbol(locale);
      return `${formatSignificant(row.value, 4, locale)}${UNIT_GAP}${symbol ? `${symbol}/kWh` : 'per kWh'}`;
    }
    case 'kWh':
      return formatEnergy(row.value * 1000, locale);
    case 'kg':
      return `${formatSignificant(row.value, 4, locale)}${UNIT_GAP}kg`;
    case 'L':
      return `${formatSignificant(row.value, 4, locale)}${UNIT_GAP}L`;
  }
}
