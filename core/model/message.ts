/**
 * Numbers in messages as quantities, not pre-printed text. A message that carries a number carries
 * it as `{ si, unit }` in `values`, with a `template` whose holes `{0}`, `{1}` … stand for them;
 * `message` is the same text rendered in SI with sensible digits (3 significant, SI prefixes where
 * the unit takes them), as the CLI prints it. The page renders the template with its own
 * formatters (the user's unit system, number format, and the unit the form works in: m³/h for a
 * pump's flow), and shows `message` when a problem or warning has no template.
 *
 *   say`is above the rated flow ${q(0.095, 'm³/s')} of ${name}`
 *     → message "is above the rated flow 0.095 m³/s of …", template "is above the rated flow {0} of …"
 */

/** The SI unit of a value in a message (°C for temperatures, h / min for durations given so). */
export type MessageUnit =
  | 'V'
  | 'A'
  | 'W'
  | 'VA'
  | 'var'
  | 'Hz'
  | 'Ω'
  | 'Ω/km'
  | 'Ω·Ah'
  | 'm'
  | 'm³/s'
  | 'kg/m³'
  | 'Pa'
  | '°C'
  | 's'
  | 'min'
  | 'h'
  | 'Ah'
  | 'rpm'
  | '%'
  | 'per W'
  | 'per hour'
  | '';

/** A number in a message: its value in SI (°C, h as the unit says) and its unit. */
export interface MessageValue {
  si: number;
  unit: MessageUnit;
  /** A flow of air (a fan's): the page shows it in the fan form's unit (m³/h or cfm), not a pump's. */
  air?: true;
}

/** A message with its numbers kept as quantities (see the file's head). */
export interface Worded {
  message: string;
  template?: string;
  values?: MessageValue[];
}

/** A value for a message hole. */
export const q = (si: number, unit: MessageUnit): MessageValue => ({ si, unit });

/** Units written with an SI prefix (BIPM SI Brochure, Table 7) when the value is large or small. */
const PREFIXED: ReadonlySet<MessageUnit> = new Set(['V', 'A', 'W', 'VA', 'var', 'Hz', 'Ω', 'Ω/km', 'm', 'Pa']);

/** The SI prefixes used, largest first (BIPM SI Brochure, Table 7); core/physics/si-prefix.ts reads it too. */
export const SI_PREFIX_STEPS: readonly [number, string][] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
  [1e-15, 'f'],
];
const STEPS = SI_PREFIX_STEPS;

/** A plain number with `digits` significant digits, large whole numbers grouped in threes (SI Brochure 5.4.4). */
export function sigText(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return Number.isNaN(value) ? 'not a number' : value > 0 ? 'infinite' : 'minus infinite';
  const n = Number(value.toPrecision(digits));
  const a = Math.abs(n);
  let text: string;
  if (a !== 0 && a < 1e-4) {
    // A tiny number: a power of ten, not a run of zeros ("4.17 × 10⁻⁵").
    const [m, e] = n.toExponential(digits - 1).split('e');
    text = `${Number(m)} × 10${superscript(Number(e))}`;
  } else if (a >= 1e15) {
    // From the value itself: rounding 1.797e308 to 3 digits overflows to Infinity.
    const [m, e] = value.toExponential(digits - 1).split('e');
    text = `${Number(m)} × 10${superscript(Number(e))}`;
  } else if (a >= 1e6 && Number.isInteger(n)) {
    text = String(n).replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f');
  } else text = String(n);
  return text.replace(/^-/, '−');
}

/**
 * A figure written with `decimals` decimals as the text reports do ("5.0 A", "0.080 %"), unless that
 * shows more than 4 significant digits ("1920.0 V"): then 4 significant digits ("1920 V").
 */
export function figure(x: number, decimals: number): string {
  if (!Number.isFinite(x)) return sigText(x);
  const fixed = x.toFixed(decimals);
  return fixed.replace(/^-?0*\.?0*/, '').replace('.', '').length > 4 ? sigText(x, 4) : fixed;
}

const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const superscript = (e: number): string => (e < 0 ? '⁻' : '') + String(Math.abs(e)).split('').map((d) => SUPERSCRIPTS[Number(d)]).join('');

/** A value as the CLI and the SI rendering of a message write it: 3 significant digits, SI prefixes where the unit takes them. */
export function valueText(v: MessageValue): string {
  const a = Math.abs(v.si);
  // Prefixes for large values only, as the range messages always wrote them: "0.1 V to 1 MV" reads
  // better than "100 mV to 1 MV"; a tiny value is written with its power of ten (sigText).
  if (PREFIXED.has(v.unit) && Number.isFinite(v.si) && a >= 1000) {
    const [factor, prefix] = STEPS.find(([f]) => a >= f * (1 - 1e-12)) ?? STEPS[STEPS.length - 1]!;
    return `${sigText(v.si / factor)} ${prefix}${v.unit}`;
  }
  if (v.unit === '%') return `${sigText(v.si)} %`;
  return v.unit ? `${sigText(v.si)} ${v.unit}` : sigText(v.si);
}

/** A hole of a message: a quantity, a message of its own (its quantities kept), a count (written as it is) or text (a name, a label). */
export type Hole = MessageValue | Worded | string | number;

/** Build a message with its quantities kept (see the file's head). Text holes are taken as they are. */
export function say(strings: TemplateStringsArray, ...holes: readonly Hole[]): Worded {
  let message = strings[0]!;
  let template = strings[0]!;
  const values: MessageValue[] = [];
  holes.forEach((h, i) => {
    const next = strings[i + 1]!;
    if (typeof h === 'object' && 'si' in h) {
      template += `{${values.length}}`;
      values.push(h);
      message += valueText(h);
    } else if (typeof h === 'object') {
      const shift = values.length;
      template += (h.template ?? h.message).replace(/\{(\d+)\}/g, (m, k: string) => (h.template ? `{${Number(k) + shift}}` : m));
      values.push(...(h.values ?? []));
      message += h.message;
    } else {
      template += String(h);
      message += String(h);
    }
    message += next;
    template += next;
  });
  return values.length ? { message, template, values } : { message };
}

/** Fill a template's holes with the given texts (the page passes its own formatting of each value). */
export function fillTemplate(template: string, texts: readonly string[]): string {
  return template.replace(/\{(\d+)\}/g, (m, i: string) => texts[Number(i)] ?? m);
}

/** A message's quantities as a schema issue's `params` (read back by core/solve/validate.ts). */
export const wordedParams = (w: Worded): Record<string, unknown> | undefined => (w.template ? { template: w.template, values: w.values } : undefined);

/** The quantities of a schema issue's `params`, when it has them. */
export function wordedFromParams(params: unknown): Pick<Worded, 'template' | 'values'> {
  if (typeof params !== 'object' || params === null) return {};
  const { template, values } = params as { template?: unknown; values?: unknown };
  return typeof template === 'string' && Array.isArray(values) ? { template, values: values as MessageValue[] } : {};
}
