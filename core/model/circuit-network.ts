/**
 * The file format, part 6: a circuit network of resistors, inductors and capacitors, the
 * `network-load`'s impedance (read by core/physics/network.ts).
 */

/** A component value: a number in the base unit (Ω, H, F) or text with an SI prefix ("4.7 mH", "220 µF", "10k"). */
export type ComponentValue = number | string;

/**
 * A circuit network as entered in a project: each entry is exactly one of
 * `{ "resistor": value }` (Ω), `{ "inductor": value }` (H), `{ "capacitor": value }` (F),
 * `{ "series": [entries…] }` or `{ "parallel": [entries…] }`, nested as deep as needed
 * (up to MAX_NETWORK_DEPTH levels, MAX_NETWORK_COMPONENTS components).
 * Example, a 12 Ω resistor in series with 40 mH parallel 100 µF:
 * `{ "series": [ { "resistor": "12 Ω" }, { "parallel": [ { "inductor": "40 mH" }, { "capacitor": "100 µF" } ] } ] }`.
 */
export type CircuitNetwork =
  | { resistor: ComponentValue }
  | { inductor: ComponentValue }
  | { capacitor: ComponentValue }
  | { series: CircuitNetwork[] }
  | { parallel: CircuitNetwork[] };
