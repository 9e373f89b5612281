/**
 * The battery panel's sizing: the bank for the target runtime, what governs it, and the working step by step.
 */
import type { BackupStudyResult, Derate } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatEnergy, formatPercent, formatPower, formatSignificant, formatVoltage, UNIT_GAP } from '../../format/number.ts';
import { formatTemperature, type UnitSystem } from '../../format/units.ts';
import { CsvButton } from '../report/CsvButton.tsx';

/** A derate's value in words: a share, a factor, an energy, a time. */
export function derateValue(d: Derate, locale: string | undefined, units: UnitSystem): string {
  switch (d.unit) {
    case '':
      return d.label.includes('depth of discharge') ? formatPercent(d.value, locale, 3) : `×${UNIT_GAP}${formatSignificant(d.value, 3, locale)}`;
    case 'Wh':
      return formatEnergy(d.value, locale);
    case 'W':
      return formatPower(d.value, locale);
    case 'h':
      return formatDuration(d.value * 3600, locale);
    case 'A':
      return formatCurrent(d.value, locale);
    case 'V':
      return formatVoltage(d.value, locale);
    case '°C':
      return formatTemperature(d.value, units, locale);
    default:
      return `${formatSignificant(d.value, 4, locale)}${UNIT_GAP}${d.unit}`;
  }
}

const METHOD_WORDS = {
  energy: 'lithium energy method',
  'ieee-485-worksheet': 'IEEE 485 duty-cycle worksheet',
  'ieee-1115-worksheet': 'IEEE 1115 duty-cycle worksheet',
} as const;

function governingWords(g: NonNullable<BackupStudyResult['sizing']>['governing']): string {
  switch (g.kind) {
    case 'section':
      return `worksheet section ${g.section}`;
    case 'energy':
      return 'the energy over the target runtime';
    case 'discharge-rate':
      return 'the maximum discharge rate';
    case 'depth-of-discharge':
      return 'the usable depth of discharge';
  }
}

/** The value of a named step of the working (NaN when the sizing has none). */
function stepOf(s: NonNullable<BackupStudyResult['sizing']>, label: string): number {
  return s.steps.find((x) => x.label === label)?.value ?? Number.NaN;
}

function stepValue(value: number, unit: string, locale: string | undefined): string {
  const n = Number.isInteger(value) ? formatSignificant(value, 12, locale) : formatSignificant(value, 4, locale);
  return unit ? `${n}${UNIT_GAP}${unit}` : n;
}

export function Sizing({ study, locale }: { study: BackupStudyResult; locale: string | undefined }) {
  const again = study.sizedDischarge;
  const s = study.sizing;
  if (!s) {
    return (
      <section class="panel-section" aria-labelledby="battery-sizing-heading">
        <h4 id="battery-sizing-heading">Bank for the target runtime</h4>
        <p class="note">Give a target runtime in the study settings to size a bank for it.</p>
      </section>
    );
  }
  const governingSection = s.governing.kind === 'section' ? s.sections.find((x) => x.section === (s.governing as { section: number }).section) : undefined;
  return (
    <section class="panel-section" aria-labelledby="battery-sizing-heading" data-testid="battery-sizing">
      <h4 id="battery-sizing-heading">Bank for the target runtime</h4>
      <p class="panel-headline" data-testid="battery-sizing-result">
        {s.strings} string{s.strings > 1 ? 's' : ''} × {formatSignificant(s.capacityPerString, 4, locale)}
        {UNIT_GAP}Ah = <strong data-testid="battery-sizing-ah">{formatSignificant(s.bankCapacity, 4, locale)}{UNIT_GAP}Ah</strong>, {formatEnergy(s.bankEnergyWh, locale)}
      </p>
      <p class="note">
        Each string: {s.seriesBlocks} {s.cellsPerBlock > 1 ? `${s.cellsPerBlock}-cell blocks` : 'cells'} in series, {formatVoltage(s.nominalVoltage, locale)} nominal.
      </p>
      {again && (
        <p class="panel-headline" data-testid="battery-sized-runtime">
          Runtime of this bank through the chain:{' '}
          <strong>
            {again.runtimeIsLowerBound ? 'longer than ' : ''}
            {formatDuration(again.runtimeSeconds, locale)}
          </strong>{' '}
          — {again.endText}
        </p>
      )}
      <p class="note">
        By the {METHOD_WORDS[s.method]}; the size is set by {governingWords(s.governing)}. Design margin ×{formatSignificant(stepOf(s, 'Design margin'), 3, locale)}, aging factor ×
        {formatSignificant(stepOf(s, 'Aging factor'), 3, locale)}. Duty cycle: {study.sizingBasis}.
      </p>
      <p class="note" data-testid="battery-sizing-basis">
        {s.basis}
      </p>
      <details class="panel-steps">
        <summary>The working, step by step</summary>
        <CsvButton name="Battery sizing steps" />
        <div class="table-scroll" role="region" aria-label="Sizing steps" tabIndex={0}>
          <table class="data panel-table">
            <thead>
              <tr>
                <th scope="col">Step</th>
                <th scope="col" class="num">Value</th>
                <th scope="col">How</th>
              </tr>
            </thead>
            <tbody>
              {s.steps.map((st, i) => (
                <tr key={i}>
                  <th scope="row">{st.label}</th>
                  <td class="num">{stepValue(st.value, st.unit, locale)}</td>
                  <td>{st.note}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {governingSection && (
          <p class="note">
            Worksheet: {s.sections.length} sections; section {governingSection.section} governs with F = {formatSignificant(governingSection.total, 4, locale)}
            {UNIT_GAP}Ah before the temperature, design-margin and aging factors.
          </p>
        )}
      </details>
      {s.warnings.length > 0 && (
        <ul class="panel-warnings">
          {s.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </section>
  );
}
