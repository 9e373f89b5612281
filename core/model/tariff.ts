/**
 * The day/night tariff: one mean price for energy used evenly over the day. Light on purpose (no
 * imports): the page reads the price in force with it before the engine has loaded.
 */

/** Default day-price hours (common practice (no source): many two-rate tariffs run their night rate from about 23:00 to 07:00). */
export const DEFAULT_DAY_START_HOUR = 7;
export const DEFAULT_DAY_END_HOUR = 23;

/** A tariff: the day price (the only price without a night price), the night price, and the day price's hours. */
export interface TariffHours {
  dayPricePerKWh: number;
  nightPricePerKWh?: number | undefined;
  dayStartHour: number;
  dayEndHour: number;
}

/** A tariff with its night price: two prices and the day price's hours. */
export type DayNightTariff = TariffHours & { nightPricePerKWh: number };

/** A project's `running` prices as a tariff, the day price's hours defaulted (DEFAULT_DAY_START_HOUR, DEFAULT_DAY_END_HOUR). */
export function tariffOfRunning(r: { energyPricePerKWh: number; nightPricePerKWh?: number | undefined; dayStartHour?: number | undefined; dayEndHour?: number | undefined }): TariffHours {
  return { dayPricePerKWh: r.energyPricePerKWh, nightPricePerKWh: r.nightPricePerKWh, dayStartHour: r.dayStartHour ?? DEFAULT_DAY_START_HOUR, dayEndHour: r.dayEndHour ?? DEFAULT_DAY_END_HOUR };
}

/** The tariff's two prices and their hours when it has a night price (the losses over a load profile pay each stretch at its hours' price), else undefined. */
export function dayNightTariff(t: TariffHours): DayNightTariff | undefined {
  return t.nightPricePerKWh === undefined ? undefined : { dayPricePerKWh: t.dayPricePerKWh, nightPricePerKWh: t.nightPricePerKWh, dayStartHour: t.dayStartHour, dayEndHour: t.dayEndHour };
}

/** The mean energy price over the day, and the hours of the day price (time-weighted mean price). */
export function meanPrice(s: TariffHours): { pricePerKWh: number; dayHours: number } {
  if (s.nightPricePerKWh === undefined) return { pricePerKWh: s.dayPricePerKWh, dayHours: 24 };
  const dayHours = s.dayEndHour - s.dayStartHour;
  // Time-weighted mean price: p̄ = (h_day·p_day + (24 − h_day)·p_night) / 24.
  return { pricePerKWh: (dayHours * s.dayPricePerKWh + (24 - dayHours) * s.nightPricePerKWh) / 24, dayHours };
}

/**
 * The hours of the day price as a load profile's energy splits them (issue 20 point 2, "hours or the duty
 * profile"): the share of the day's energy used while the day price runs, × 24 h, so that `meanPrice`
 * with these hours gives the energy-weighted mean price p̄ = s·p_day + (1 − s)·p_night, where
 * s = Σ P_i·|[a_i, b_i) ∩ [start, end)| ÷ Σ P_i·(b_i − a_i) over the profile's intervals on the clock
 * (a step function integrated exactly). The losses are taken to follow the load through the day.
 * Null when the profile uses no energy (no share to take).
 */
export function profileDayHours(intervals: readonly { fromHour: number; toHour: number; watts: number }[], dayStartHour: number, dayEndHour: number): { dayHours: number; dayShare: number } | null {
  let total = 0;
  let day = 0;
  for (const iv of intervals) {
    const w = Math.max(0, iv.watts);
    total += w * (iv.toHour - iv.fromHour);
    const overlap = Math.min(iv.toHour, dayEndHour) - Math.max(iv.fromHour, dayStartHour);
    if (overlap > 0) day += w * overlap;
  }
  if (!(total > 0) || !Number.isFinite(total)) return null;
  const dayShare = day / total;
  return { dayHours: 24 * dayShare, dayShare };
}
