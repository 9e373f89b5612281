/** The cost over the years, part 4: its plain text for the command line (core/studies/lifetime.ts holds the entry). */
import { sigText } from '../model/message.ts';
import type { LifetimeCost } from './lifetime.ts';

/** The lifetime cost's method and what it leaves out, in words (the comparison of variants prints it too). */
export const LIFETIME_METHOD_WORDS =
  'Lifetime cost: net present value, purchase + Σ yearly cost ÷ (1 + r)^t for t = 1…N years; the yearly cost is the losses’ energy (and a generator’s fuel) at today’s prices, the same each year. Not counted: replacing parts that wear out within those years (a battery bank, for one), maintenance, and rises in the energy or fuel price.';

/** The cost over the years as plain text (the command line; money without a currency symbol, the file holds none). */
export function formatLifetimeCost(c: LifetimeCost): string {
  const money = (v: number) => (Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toFixed(2));
  const lines = ['Cost over the years:'];
  lines.push(`  Losses: ${sigText(c.losses.totalEnergyKWh, 4)} kWh a year, costing ${money(c.losses.totalCost)} a year (${c.notes[0]})`);
  if (c.co2KgPerYear !== undefined) lines.push(`  CO₂ of the losses: ${sigText(c.co2KgPerYear, 4)} kg a year (losses' energy × the grid factor entered)`);
  if (c.generator) {
    const g = c.generator;
    for (const r of g.runs) {
      lines.push(`  Generator through the ${r.what}: ${sigText(r.powerW / 1000, 4)} kW (${sigText(r.loadFraction * 100, 3)} % of ${sigText(g.ratedPowerW / 1000, 4)} kW) for ${sigText(r.hoursPerYear, 4)} h a year: ${sigText(r.litresPerHour, 4)} L/h, ${sigText(r.litresPerYear, 4)} L a year`);
    }
    lines.push(`  Generator fuel: ${sigText(g.litresPerYear, 4)} L a year (fuel table interpolated linearly between ¼, ½ and full load)${g.fuelCostPerYear !== undefined ? `, costing ${money(g.fuelCostPerYear)} a year` : ''}`);
  }
  lines.push(`  Purchase: ${money(c.purchase)}${c.priced.length ? ` (${c.priced.length} priced element${c.priced.length === 1 ? '' : 's'})` : ''}${c.unpriced.length ? `; no price given for ${c.unpriced.map((n) => `"${n.name}"`).join(', ')}` : ''}`);
  lines.push(`  Yearly cost counted: ${money(c.yearlyCost)}`);
  lines.push(
    `  Lifetime cost over ${c.years} year${c.years === 1 ? '' : 's'} at ${sigText(c.discountRate * 100, 3)} % a year: ${money(c.npv)} (net present value: purchase + Σ yearly cost ÷ (1 + r)^t, t = 1…${c.years})`,
  );
  for (const n of c.notes.slice(1)) lines.push(`  Note: ${n}`);
  lines.push('  Not counted: replacing parts that wear out within those years (a battery bank, for one), maintenance, and rises in the energy or fuel price (each year costs the same).');
  return lines.join('\n');
}
