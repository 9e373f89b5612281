/**
 * The day/night tariff: one mean price for energy used evenly over the day. Light on purpose (no
 * imports): the page reads the price in force with it before the engine has loaded.
 */

/** Default day-price hours (common practice (no source): many two-rate tariffs run their night rate from about 23:00 to 07:00). */
export const DEFAULT_DAY_START_HOUR = 7;
export const DEFAULT_DAY_END_HOUR = 23;

/** The mean energy price over the day, and the hours of the day price (time-weighted mean price). */
export function meanPrice(s: { dayPricePerKWh: number; nightPricePerKWh?: number | undefined; dayStartHour: number; dayEndHour: number }): { pricePerKWh: number; dayHours: number } {
  if (s.nightPricePerKWh === undefined) return { pricePerKWh: s.dayPricePerKWh, dayHours: 24 };
  const dayHours = s.dayEndHour - s.dayStartHour;
  // Time-weighted mean price: p̄ = (h_day·p_day + (24 − h_day)·p_night) / 24.
  return { pricePerKWh: (dayHours * s.dayPricePerKWh + (24 - dayHours) * s.nightPricePerKWh) / 24, dayHours };
}

/** The price the losses are costed at from a project's `running` settings: the day's mean with a night price, else the energy price. */
export function priceOfRunning(r: { energyPricePerKWh: number; nightPricePerKWh?: number | undefined; dayStartHour?: number | undefined; dayEndHour?: number | undefined }): number {
  return meanPrice({ dayPricePerKWh: r.energyPricePerKWh, nightPricePerKWh: r.nightPricePerKWh, dayStartHour: r.dayStartHour ?? DEFAULT_DAY_START_HOUR, dayEndHour: r.dayEndHour ?? DEFAULT_DAY_END_HOUR }).pricePerKWh;
}
