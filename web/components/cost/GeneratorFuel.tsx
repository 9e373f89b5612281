/**
 * The generator's part of the cost over the years: its fuel at ¼, ½ and full load (L/h, the maker's fuel
 * table), its rated power, the outage hours (and outages) a year and the fuel's price. "Fill typical
 * values" takes the three fuel figures from the suppliers' chart (core/data/diesel-fuel-typical.ts through
 * core's `typicalFuelFigures`) for the rated power in force; a figure equal to the typical one says so
 * under it. A project without a generator offers to start counting one, with typical figures.
 */
import { useState } from 'preact/hooks';
import type { Solved } from '../../../core/page.ts';
import { PROJECT_LEVEL } from '../../../core/page.ts';
import { GENERATOR_RATED_POWER_FACTOR, typicalFuelFigures } from '../../../core/studies/index.ts';
import { formatSignificant } from '../../format/number.ts';
import { currencySymbol } from '../../format/panels.ts';
import type { UnitSystem } from '../../format/units.ts';
import { setFieldError, type DraftProject } from '../../state/editor.ts';
import { SettingField } from '../SettingField.tsx';
import type { Locale } from '../machines/shared.tsx';
import { writeLifetime } from './write.ts';

type Fuel = { quarterLoadLitresPerHour: number; halfLoadLitresPerHour: number; fullLoadLitresPerHour: number };
const FUEL_KEYS = ['quarterLoadLitresPerHour', 'halfLoadLitresPerHour', 'fullLoadLitresPerHour'] as const;
const FUEL_LABELS: Record<(typeof FUEL_KEYS)[number], string> = {
  quarterLoadLitresPerHour: 'Generator fuel at ¼ load (L/h)',
  halfLoadLitresPerHour: 'Generator fuel at ½ load (L/h)',
  fullLoadLitresPerHour: 'Generator fuel at full load (L/h)',
};
const TEST_IDS: Record<(typeof FUEL_KEYS)[number], string> = { quarterLoadLitresPerHour: 'lifetime-fuel-quarter', halfLoadLitresPerHour: 'lifetime-fuel-half', fullLoadLitresPerHour: 'lifetime-fuel-full' };
/**
 * Core's typical fuel figures at three significant digits: a suppliers' estimate carries no more (its chart
 * prints tenths of a gallon), and the field then shows "6.09", not the conversion's fifteen digits.
 */
function typicalShown(ratedW: number): Fuel | null {
  const t = typicalFuelFigures(ratedW);
  if (!t) return null;
  const r = (v: number) => Number(v.toPrecision(3));
  return { quarterLoadLitresPerHour: r(t.quarterLoadLitresPerHour), halfLoadLitresPerHour: r(t.halfLoadLitresPerHour), fullLoadLitresPerHour: r(t.fullLoadLitresPerHour) };
}

/** The smallest set the typical chart lists, W (core/data/diesel-fuel-typical.ts). */
const SMALLEST_CHART_SET_W = 20_000;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The chain's own generator's rated real power (its kVA rating × the rated power factor), when the chain's source is one. */
function chainGeneratorW(solved: Solved): number | undefined {
  const root = solved.project.elements.find((e) => !('from' in e) || e.from === undefined);
  return root?.kind === 'generator' && root.ratedApparentPower !== undefined ? root.ratedApparentPower * GENERATOR_RATED_POWER_FACTOR : undefined;
}

export function GeneratorFuelFields({ project, solved, units, locale }: { project: DraftProject; solved: Solved; units: UnitSystem; locale: Locale }) {
  const running = isRecord(project['running']) ? project['running'] : {};
  const gen = isRecord(running['generator']) ? running['generator'] : null;
  const fromChain = chainGeneratorW(solved);
  const common = { project, units, locale };
  const symbol = currencySymbol(locale);
  /** Raised when the typical values are filled in: the fuel fields start afresh (a refused text typed there gives way to the figures filled). */
  const [round, setRound] = useState(0);
  if (!gen) {
    // A suggestion to start from: the chain's generator, or a set that carries the chain's source power (at least the chart's smallest).
    const sourceW = solved.result.elements.find((e) => e.role === 'source')?.pOut ?? 0;
    const rated = fromChain ?? Math.max(SMALLEST_CHART_SET_W, Math.ceil(sourceW / 1000) * 1000);
    const typical = typicalShown(rated);
    return (
      <div class="cost-years__generator" data-testid="lifetime-generator">
        <h5 class="cost-years__subhead">Generator fuel</h5>
        <p class="note">
          A generator that carries the outages (or recharges the bank after them) burns fuel. Count it from typical figures for a {formatSignificant(rated / 1000, 4, locale)} kW set
          {fromChain === undefined ? ' (sized to the chain’s load; change it to your generator’s rated power)' : ' (the chain’s generator)'}, then put in the maker’s figures and your outage hours.
        </p>
        {typical ? (
          <button
            type="button"
            class="panel-button"
            data-testid="lifetime-generator-add"
            onClick={() =>
              writeLifetime(
                project,
                'generator',
                {
                  quarterLoadLitresPerHour: typical.quarterLoadLitresPerHour,
                  halfLoadLitresPerHour: typical.halfLoadLitresPerHour,
                  fullLoadLitresPerHour: typical.fullLoadLitresPerHour,
                  outageHoursPerYear: 0,
                  ...(fromChain === undefined ? { ratedPower: rated } : {}),
                },
                'Generator fuel and outages',
              )
            }
          >
            Count a generator’s fuel
          </button>
        ) : (
          <p class="note">There are no typical fuel figures for a set of this size (the chart runs from 20 kW to 2 MW).</p>
        )}
      </div>
    );
  }
  const ratedInForce = typeof gen['ratedPower'] === 'number' ? gen['ratedPower'] : fromChain;
  const typical = ratedInForce !== undefined ? typicalShown(ratedInForce) : null;
  const isTypical = (k: (typeof FUEL_KEYS)[number]) => typical !== null && typeof gen[k] === 'number' && Math.abs((gen[k] as number) - typical[k]) <= 1e-9 * typical[k];
  const fill = (t: Fuel) => {
    const message = writeLifetime(project, 'generator', { ...gen, quarterLoadLitresPerHour: t.quarterLoadLitresPerHour, halfLoadLitresPerHour: t.halfLoadLitresPerHour, fullLoadLitresPerHour: t.fullLoadLitresPerHour }, 'Generator fuel and outages');
    if (message !== null) return;
    for (const k of FUEL_KEYS) setFieldError(PROJECT_LEVEL, `running.generator.${k}`, null);
    setRound((r) => r + 1);
  };
  const field = (key: string, label: string) => ({ path: `running.generator.${key}`, label, write: (v: number | undefined) => writeLifetime(project, `generator.${key}`, v, label) });
  return (
    <div class="cost-years__generator" data-testid="lifetime-generator">
      <h5 class="cost-years__subhead">Generator fuel</h5>
      <div class="study-settings study-settings--inline">
        <SettingField
          {...common}
          {...field('ratedPower', 'Generator rated power')}
          quantity="power-rating"
          fallback={undefined}
          placeholder={fromChain !== undefined ? formatSignificant(fromChain / 1000, 4, locale) : undefined}
          help={fromChain !== undefined ? 'Empty: the chain’s generator, its kVA rating × 0.8 (the rated power factor of generating sets).' : 'Needed: the chain’s source is not a generator. Use the rating plate’s kW.'}
          testId="lifetime-generator-rated"
        />
        {FUEL_KEYS.map((k) => (
          <SettingField
            key={`${k}-${round}`}
            {...common}
            {...field(k, FUEL_LABELS[k])}
            quantity="ratio"
            unit="L/h"
            help={isTypical(k) ? 'Typical value: use the maker’s figure.' : 'From the maker’s fuel table.'}
            testId={TEST_IDS[k]}
          />
        ))}
        <SettingField {...common} {...field('outageHoursPerYear', 'Outage hours per year')} quantity="time" help="Hours a year the supply is out; your supplier’s or your own records." testId="lifetime-outage-hours" />
        <SettingField
          {...common}
          {...field('outagesPerYear', 'Outages per year')}
          quantity="count"
          help="With a battery bank: how often it is recharged after an outage (the generator runs the charger). Empty: no recharges counted."
          testId="lifetime-outages"
        />
        <SettingField
          {...common}
          {...field('fuelPricePerLitre', 'Fuel price per litre')}
          quantity="ratio"
          unit={symbol ? `${symbol}/L` : 'per L'}
          help="Your fuel price. Empty: the fuel is counted in litres, not in the yearly cost."
          testId="lifetime-fuel-price"
        />
      </div>
      <p class="cost-years__actions">
        {typical && (
          <button type="button" class="panel-button" data-testid="lifetime-fuel-typical" onClick={() => fill(typical)}>
            Fill typical values
          </button>
        )}
        <button type="button" class="panel-button" data-testid="lifetime-generator-remove" onClick={() => writeLifetime(project, 'generator', undefined, 'Generator fuel and outages')}>
          Stop counting the generator
        </button>
      </p>
      {typical && <p class="note">Typical values: a suppliers’ chart of diesel sets, for {formatSignificant((ratedInForce ?? 0) / 1000, 4, locale)} kW; the maker’s fuel table replaces them.</p>}
    </div>
  );
}
