/**
 * One stage card of the chain editor: the element's name, its kind in words, one or two key inputs
 * read from the element, and once solved its key result from the engine's last valid result, with a
 * mark when the engine reports a problem on it. Display only: every figure is either an input as
 * typed or a value from the engine's result, formatted.
 */
import { memo } from 'preact/compat';
import type { ElementResult } from '../../core/page.ts';
import { openCount } from '../state/editor.ts';
import { studyAnswers } from './answers/study-answers.ts';
import type { FeedingPort } from '../editor/templates.ts';
import { elementKindLabel, portKindLabel } from '../format/labels.ts';
import { formatApparent, formatCurrent, formatDuration, formatFrequency, formatPercent, formatPower, formatSignificant, formatVoltage, UNIT_GAP } from '../format/number.ts';
import { inputUnit } from '../format/parse.ts';
import { formatLength, formatShaftPower, type UnitSystem } from '../format/units.ts';
import type { DraftElement } from '../state/editor.ts';

const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const rec = (v: unknown): Record<string, unknown> | undefined => (typeof v === 'object' && v !== null && !Array.isArray(v) ? (v as Record<string, unknown>) : undefined);

const phaseWord = (phases: unknown) => (phases === 3 ? '3φ' : '1φ');

/** A loss model in a few words: "95 %", "curve, 3 kW", "loss polynomial". */
function lossWords(loss: unknown, locale: string | undefined): string | undefined {
  const l = rec(loss);
  if (!l) return undefined;
  const rated = num(l['ratedPower']);
  const ratedText = rated !== undefined ? `, ${formatPower(rated, locale)}` : '';
  switch (l['model']) {
    case 'constant': {
      const eff = num(l['efficiency']);
      return eff === undefined ? undefined : `η ${formatPercent(eff, locale, 3)}`;
    }
    case 'curve':
      return `efficiency curve${ratedText}`;
    case 'polynomial':
      return `loss polynomial${ratedText}`;
    case 'polynomial-fit':
      return `fitted loss${ratedText}`;
    default:
      return undefined;
  }
}

/**
 * The key inputs of an element as one or two short lines, e.g. ["48 V → 230 V 1φ 50 Hz", "η 95 %"].
 * `input` is the nominal port feeding it (for the "from" side of a converter), when known.
 */
export function keyInputs(e: DraftElement, input: FeedingPort | undefined, units: UnitSystem, locale: string | undefined): string[] {
  const v = (x: unknown) => (num(x) !== undefined ? formatVoltage(num(x)!, locale) : '?');
  const from = input?.voltage !== undefined ? `${formatVoltage(input.voltage, locale)} → ` : '→ ';
  const lines: (string | undefined)[] = [];
  switch (e.kind) {
    case 'grid':
    case 'generator': {
      const f = num(e['frequency']);
      lines.push(`${phaseWord(e['phases'])} ${v(e['voltage'])}${f !== undefined ? ` ${formatFrequency(f, locale)}` : ''}`);
      const rated = num(e['ratedApparentPower']);
      if (rated !== undefined) lines.push(formatApparent(rated, locale));
      break;
    }
    case 'battery': {
      const bank = rec(e['bank']);
      if (bank) {
        const strings = num(bank['strings']) ?? 1;
        const chem = String(bank['chemistry'] ?? '');
        lines.push(`${chem === 'lifepo4' ? 'LiFePO4' : chem} ${num(bank['series']) ?? '?'} × ${num(bank['capacityAh']) ?? '?'} Ah${strings > 1 ? ` × ${strings}` : ''}`);
      }
      if (num(e['voltage']) !== undefined) lines.push(v(e['voltage']));
      break;
    }
    case 'inverter': {
      const f = num(e['frequency']);
      lines.push(`${from}${v(e['outputVoltage'])} ${phaseWord(e['phases'])}${f !== undefined ? ` ${formatFrequency(f, locale)}` : ''}`);
      lines.push(lossWords(e['loss'], locale));
      break;
    }
    case 'rectifier':
    case 'dc-dc':
      lines.push(`${from}${v(e['outputVoltage'])} DC`);
      lines.push(lossWords(e['loss'], locale));
      break;
    case 'generic': {
      lines.push(`${portKindLabel(String(e['inputKind']))} → ${v(e['outputVoltage'])} ${portKindLabel(String(e['outputKind']))}`);
      lines.push(lossWords(e['loss'], locale));
      break;
    }
    case 'transfer-switch': {
      const rated = num(e['ratedCurrent']);
      const t = num(e['transferTime']);
      lines.push([rated !== undefined ? `rated ${formatCurrent(rated, locale)}` : undefined, t !== undefined ? `transfer ${formatSignificant(t * 1000, 3, locale)}${UNIT_GAP}ms` : undefined].filter(Boolean).join(', ') || undefined);
      break;
    }
    case 'dc-bus': {
      const loss = num(e['fixedLoss']);
      if (loss !== undefined) lines.push(`own loss ${formatPower(loss, locale)}`);
      break;
    }
    case 'transformer': {
      lines.push(`${v(e['primaryVoltage'])} → ${v(e['secondaryVoltage'])}`);
      const s = num(e['ratedApparentPower']);
      if (s !== undefined) lines.push(formatApparent(s, locale));
      break;
    }
    case 'drive': {
      const f = num(e['outputFrequency']);
      lines.push(`→ ${v(e['outputVoltage'])} 3φ${f !== undefined ? ` ${formatFrequency(f, locale)}` : ''}`);
      lines.push(lossWords(e['loss'], locale) ?? (e['standardLoss'] ? 'IEC 61800-9-2 losses' : undefined));
      break;
    }
    case 'motor': {
      const rated = num(e['ratedOutput']);
      const cls = typeof e['efficiencyClass'] === 'string' ? (e['efficiencyClass'] === 'NEMA-premium' ? 'NEMA Premium' : e['efficiencyClass']) : undefined;
      lines.push([rated !== undefined ? formatShaftPower(rated, units, locale) : undefined, cls].filter(Boolean).join(', '));
      break;
    }
    case 'cable': {
      const length = num(e['length']);
      const conductor = rec(e['conductor']);
      const size = conductor ? (conductor['size'] === 'auto' ? 'size by the code' : String(conductor['size'] ?? '')) : undefined;
      const r = num(e['resistancePerKm']);
      lines.push([length !== undefined ? formatLength(length, units, locale) : undefined, size ?? (r !== undefined ? `${r} Ω/km` : undefined)].filter(Boolean).join(', '));
      break;
    }
    case 'dc-load':
    case 'shaft-load': {
      const p = num(e['power']);
      if (p !== undefined) lines.push(e.kind === 'shaft-load' ? formatShaftPower(p, units, locale) : formatPower(p, locale));
      break;
    }
    case 'ac-load':
    case 'ac-va-load': {
      const p = num(e.kind === 'ac-load' ? e['power'] : e['apparentPower']);
      const pf = num(e['powerFactor']);
      lines.push(
        [p !== undefined ? (e.kind === 'ac-load' ? formatPower(p, locale) : formatApparent(p, locale)) : undefined, pf !== undefined ? `pf ${pf}` : undefined]
          .filter(Boolean)
          .join(', '),
      );
      break;
    }
    case 'dc-current-load':
    case 'ac-current-load': {
      const i = num(e['current']);
      const pf = e.kind === 'ac-current-load' ? num(e['powerFactor']) : undefined;
      lines.push([i !== undefined ? formatCurrent(i, locale) : undefined, pf !== undefined ? `pf ${pf}` : undefined].filter(Boolean).join(', '));
      break;
    }
    case 'network-load':
      lines.push(e['connection'] ? `R, L, C in ${String(e['connection'])}` : 'R, L, C network');
      break;
    case 'fan':
      lines.push(e['control'] === 'speed' ? 'speed control' : 'outlet damper');
      if (num(e['ratedPressure']) !== undefined) {
        const unit = inputUnit('pressure', units);
        lines.push(`${formatSignificant(unit.fromSi(num(e['ratedPressure'])!), 3, locale)}${UNIT_GAP}${unit.symbol} rated`);
      }
      break;
    case 'pump':
      lines.push(e['control'] === 'speed' ? 'speed control' : 'throttled');
      if (num(e['ratedHead']) !== undefined) lines.push(`head ${formatLength(num(e['ratedHead'])!, units, locale)}`);
      break;
    default:
      break;
  }
  return lines.filter((x): x is string => typeof x === 'string' && x.length > 0).slice(0, 2);
}

/** Result lines already formatted, per solved element (each solve gives new objects; a card compares the old and the new one). */
const shownLines = new WeakMap<ElementResult, { units: UnitSystem; locale: string | undefined; text: string }>();

/** keyResult, formatted once per solved element, unit system and locale. */
function resultLine(r: ElementResult, units: UnitSystem, locale: string | undefined): string {
  const known = shownLines.get(r);
  if (known && known.units === units && known.locale === locale) return known.text;
  const text = keyResult(r, units, locale);
  shownLines.set(r, { units, locale, text });
  return text;
}

/** Kinds whose card shows the efficiency at this load (they convert; cables and buses only lose). */
const CONVERTERS: ReadonlySet<string> = new Set(['inverter', 'rectifier', 'dc-dc', 'generic', 'drive', 'transformer']);

/**
 * The key result of a solved element in one line: what it delivers or uses, and its key figure: a
 * sized cable its size, device and drop; a converter its efficiency at this load; a bank its current
 * (the solve's, at the charged bank's voltage); other stages their loss.
 */
export function keyResult(r: ElementResult, units: UnitSystem, locale: string | undefined): string {
  const power = (w: number, shaft: boolean) => (shaft ? formatShaftPower(w, units, locale) : formatPower(w, locale));
  if (r.role === 'load') return `uses ${power(r.pOut, r.input?.kind === 'shaft')}`;
  const out = power(r.pOut, r.output?.kind === 'shaft');
  if (r.role === 'source') return r.kind === 'battery' && r.output ? `delivers ${out} · ${formatCurrent(r.output.current, locale)}` : `delivers ${out}`;
  const c = r.conductor;
  if (c) {
    const device = c.device.rating !== undefined ? ` · ${formatCurrent(c.device.rating, locale)} device` : '';
    return `${c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}${c.size}${device} · ${formatPercent(c.drop.checkPercent / 100, locale, 2)} drop`;
  }
  if (CONVERTERS.has(r.kind)) return `out ${out} · η ${formatPercent(r.efficiency, locale, 3)}`;
  return `out ${out} · loss ${formatPower(r.loss, locale)}`;
}

/**
 * A bank's runtime or a motor's start verdict on its card, from the latest study answers of the open
 * project (the panel worker's, after the paint: study-answers.ts; never another project's). Only these
 * cards read the answers, so their arrival renders them alone; an edit does not (the card keeps the
 * last figure until the next answers arrive; the answers strip marks them as updating meanwhile).
 */
function CardStudyFigure({ id, kind, locale }: { id: string; kind: string; locale: string | undefined }) {
  const entry = studyAnswers.value;
  const answers = entry && entry.open === openCount.value && entry.outcome.ok ? entry.outcome.answers : undefined;
  let text: string | undefined;
  if (kind === 'battery') {
    const b = answers?.banks.find((x) => x.elementId === id);
    if (b) text = `runtime ${b.runtimeIsLowerBound ? 'over ' : ''}${formatDuration(b.runtimeSeconds, locale)} · cable ${formatCurrent(b.cableCurrent.amps, locale)}`;
  } else {
    const s = answers?.starts.find((x) => x.elementId === id);
    if (s) text = s.verdict === 'starts' ? 'starts' : s.verdict === 'marginal' ? 'start is marginal' : 'will not start';
  }
  if (!text) return null;
  return (
    <span class="stage-card__figure" data-testid="stage-card-figure">
      {text}
    </span>
  );
}

export interface StageCardProps {
  element: DraftElement;
  input: FeedingPort | undefined;
  result: ElementResult | undefined;
  /** Results are the last valid ones, not those of the inputs shown. */
  stale: boolean;
  problems: number;
  selected: boolean;
  tabIndex: 0 | -1;
  units: UnitSystem;
  locale: string | undefined;
  onSelect: (id: string, how: 'pointer' | 'keyboard') => void;
  onFocus: (id: string) => void;
}

/** Same card text: the element's data and its feeding port as entered, and the result line as shown. */
function sameCard(a: StageCardProps, b: StageCardProps): boolean {
  if (
    a.stale !== b.stale ||
    a.problems !== b.problems ||
    a.selected !== b.selected ||
    a.tabIndex !== b.tabIndex ||
    a.units !== b.units ||
    a.locale !== b.locale ||
    a.onSelect !== b.onSelect ||
    a.onFocus !== b.onFocus
  ) {
    return false;
  }
  if (a.element !== b.element && JSON.stringify(a.element) !== JSON.stringify(b.element)) return false;
  if (a.input !== b.input && JSON.stringify(a.input) !== JSON.stringify(b.input)) return false;
  if (a.result === b.result) return true;
  if (!a.result || !b.result) return false;
  return resultLine(a.result, a.units, a.locale) === resultLine(b.result, b.units, b.locale);
}

/**
 * One stage of the chain as a card. Memo'd: after an edit only the cards whose data or result line
 * changed are rendered again (the handlers must keep their identity, as ChainEditor's do).
 */
export const StageCard = memo(function StageCard(props: StageCardProps) {
  const { element: e, result, problems } = props;
  const name = (typeof e.name === 'string' && e.name) || e.id;
  const inputs = keyInputs(e, props.input, props.units, props.locale);
  const classes = ['stage-card'];
  if (problems > 0) classes.push('stage-card--problem');
  if (props.stale) classes.push('stage-card--stale');
  return (
    <button
      type="button"
      class={classes.join(' ')}
      data-card-id={e.id}
      data-testid="stage-card"
      aria-pressed={props.selected}
      tabIndex={props.tabIndex}
      onClick={(ev) => props.onSelect(e.id, ev.detail === 0 ? 'keyboard' : 'pointer')}
      onFocus={() => props.onFocus(e.id)}
    >
      <span class="stage-card__name">{name}</span>
      <span class="stage-card__kind">{elementKindLabel(e.kind)}</span>
      {inputs.map((line, i) => (
        <span key={i} class="stage-card__input">
          {line}
        </span>
      ))}
      {result && (
        <span class="stage-card__result" data-testid="stage-card-result">
          {resultLine(result, props.units, props.locale)}
          {props.stale && <span class="visually-hidden"> (out of date)</span>}
        </span>
      )}
      {result && (e.kind === 'battery' || e.kind === 'motor') && <CardStudyFigure id={e.id} kind={e.kind} locale={props.locale} />}
      {problems > 0 && (
        <span class="stage-card__problem" data-testid="stage-card-problem">
          <svg viewBox="0 0 16 16" width="14" height="14" aria-hidden="true" focusable="false">
            <path d="M8 1.5 15 14.5H1Z" fill="none" stroke="currentColor" stroke-width="1.8" stroke-linejoin="round" />
            <path d="M8 6v4.2M8 11.8v.9" stroke="currentColor" stroke-width="1.8" stroke-linecap="round" />
          </svg>
          {problems === 1 ? '1 problem' : `${problems} problems`}
        </span>
      )}
    </button>
  );
}, sameCard);
