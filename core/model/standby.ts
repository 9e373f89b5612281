/**
 * The file format, part: the project's `standby` settings, read when a battery bank sits on a DC bus
 * inside a chain fed from the supply (a battery element with a `from`). The project then has two
 * modes (core/solve/modes.ts): on supply (the supply carries the loads and the bank's float or
 * recharge current) and on battery (the supply branch cut, the bank the root). These settings say
 * what the modes study (core/studies/modes/) sizes and costs; every field is optional.
 */

/** The cost of standing by is priced at the project's energy price (`running.energyPricePerKWh`). */
export interface StandbySettings {
  /** Time in which the charger must put the discharged charge back, h (default 8 h). */
  targetRechargeHours?: number;
  /**
   * Charge to put back after an outage, Ah (default: the charge the backup study's outage drew from the
   * bank when the project has a backup study, else the bank's rated capacity, all strings).
   */
  rechargeAh?: number;
  /** Charge put back per charge taken out (IEEE 946's k; default the chemistry's, core/data/standby-charge.ts). */
  chargeReturnFactor?: number;
  /** Rated output current of one rectifier or charger module, A (the modules are counted when given). */
  moduleCurrent?: number;
  /** Redundant modules beyond those the load needs (default 'n+1'). */
  redundancy?: 'none' | 'n+1';
  /** Hours per year the supply is expected to be off, h (default 0). */
  outageHoursPerYear?: number;
}
