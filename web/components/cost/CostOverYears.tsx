/**
 * The machines-and-cost panel's "Cost over the years" (issue 20 point 2): every input of the project's
 * `running` settings the lifetime cost reads (the night price and its hours, years of service, discount
 * rate, grid CO₂ factor, a generator's fuel at ¼, ½ and full load and its outage hours), each with its
 * typical value and why under it, and the figures of core's `lifetimeCost` (run in the panel worker,
 * web/components/panel-worker.ts): the yearly energy and cost of the losses, the lifetime cost (net
 * present value) with its formula, the CO₂ a year and over the years, the generator's fuel a year.
 *
 * Every value is written through the engine-checked setField (LossCost's `writeRunning`, which also
 * carries over the device's price and hours into a project without `running`): a value the engine
 * refuses keeps its message at the field and is never stored. The page computes nothing: the figures
 * are core's (lifetime-rows.ts only words them).
 */
import type { ComponentChildren } from 'preact';
import type { Solved } from '../../../core/page.ts';
import type { LifetimeOutcome } from '../../../core/studies/index.ts';
import { dutyHoursPerYear } from '../../../core/studies/index.ts';
import { formatSignificant } from '../../format/number.ts';
import { currencySymbol } from '../../format/panels.ts';
import { formatForInput } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import type { DraftProject } from '../../state/editor.ts';
import { runningInForce } from '../../state/prefs.ts';
import { SettingField } from '../SettingField.tsx';
import { type Locale, ProblemLines, ScrollTable } from '../machines/shared.tsx';
import { CsvButton } from '../report/CsvButton.tsx';
import { GeneratorFuelFields } from './GeneratorFuel.tsx';
import { lifetimeRows, rowText } from './lifetime-rows.ts';
import { writeLifetime } from './write.ts';
import './cost.css';


export function CostOverYears({ lifetime, project, solved, units, locale }: { lifetime: LifetimeOutcome | undefined; project: DraftProject; solved: Solved; units: UnitSystem; locale: Locale }) {
  const running = (project['running'] ?? {}) as Record<string, unknown>;
  const symbol = currencySymbol(locale);
  const perKWh = symbol ? `${symbol}/kWh` : 'per kWh';
  const common = { project, units, locale };
  const field = (key: string, label: string) => ({ path: `running.${key}`, label, write: (v: number | undefined) => writeLifetime(project, key, v, label) });
  // The price in force: the project's, or this device's until the project holds one (the first write here stores it).
  const hasPrice = runningInForce(project).price !== null;
  const hasYears = typeof running['years'] === 'number';
  const rows = lifetime?.ok ? lifetimeRows(lifetime.cost) : [];
  return (
    <section class="panel-section cost-years" aria-labelledby="lifetime-heading" data-testid="lifetime-cost">
      <h4 id="lifetime-heading">Cost over the years</h4>
      <p class="note">The energy price and hours a year above, and these settings (kept in the project):</p>
      <div class="study-settings study-settings--inline">
        <SettingField
          {...common}
          {...field('nightPricePerKWh', 'Night energy price per kWh')}
          quantity="ratio"
          unit={perKWh}
          help="Only with a two-rate tariff: then the price above is the day price. Empty: one price all day."
          testId="lifetime-night-price"
        />
        <SettingField
          {...common}
          {...field('dayStartHour', 'Day price from (hour)')}
          quantity="time"
          placeholder={formatForInput(7, locale)}
          help="Typical value: 7 (a day rate from 07:00 to 23:00); use your tariff's hours."
          testId="lifetime-day-start"
        />
        <SettingField
          {...common}
          {...field('dayEndHour', 'Day price until (hour)')}
          quantity="time"
          placeholder={formatForInput(23, locale)}
          help="Typical value: 23; use your tariff's hours."
          testId="lifetime-day-end"
        />
        <SettingField
          {...common}
          {...field('years', 'Years of service')}
          quantity="count"
          unit="years"
          placeholder={`e.g. ${formatForInput(20, locale)}`}
          help="How long the chain serves; the lifetime cost counts this many years of losses. Empty: no lifetime cost."
          testId="lifetime-years"
        />
        <SettingField
          {...common}
          {...field('discountRate', 'Discount rate per year (%)')}
          quantity="fraction-percent"
          placeholder={formatForInput(0, locale)}
          help="Typical value: your organisation's cost of money, a few % a year; 0 keeps money at its value (empty: 0)."
          testId="lifetime-discount"
        />
        <SettingField
          {...common}
          {...field('gridCo2KgPerKWh', 'Grid CO₂ per kWh (kg)')}
          quantity="ratio"
          unit="kg/kWh"
          help="Use your supplier's or grid operator's figure. Empty: no CO₂."
          testId="lifetime-co2"
        />
      </div>
      <DutyHours project={project} locale={locale} />
      <GeneratorFuelFields project={project} solved={solved} units={units} locale={locale} />
      {!(hasPrice && hasYears) && (
        <p class="note" data-testid="lifetime-missing">
          Give {hasPrice ? '' : 'the energy price above'}
          {hasPrice || hasYears ? '' : ' and '}
          {hasYears ? '' : 'the years of service'} to see the cost over the years.
        </p>
      )}
      {lifetime && !lifetime.ok && hasPrice && hasYears && <ProblemLines problems={lifetime.problems} />}
      {rows.length > 0 && lifetime?.ok && (
        <>
          <CsvButton name="Cost over the years" />
          <ScrollTable labelledBy="lifetime-heading">
            <table class="data panel-table" data-testid="lifetime-table">
              <thead>
                <tr>
                  <th scope="col">What, and how it is worked out</th>
                  <th scope="col" class="num">Figure</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.key}>
                    <th scope="row">
                      {r.label}
                      <span class="cost-years__how">{r.how}</span>
                    </th>
                    <td class="num" data-testid={`lifetime-${r.key}`}>
                      {rowText(r, locale)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </ScrollTable>
          {lifetime.cost.dayHoursFrom === 'load profile' && (
            <p class="note" data-testid="lifetime-split-note">
              These figures and “What the losses cost per year” above both split the day and night prices as the load profile uses its day: one mean price.
            </p>
          )}
          <p class="note" data-testid="lifetime-unpriced">
            {lifetime.cost.unpriced.length === 0
              ? 'Every element has a purchase price.'
              : `Purchase prices are given in each element’s form (“Purchase price”, at its end)${lifetime.cost.priced.length ? '' : ': none is given yet'}. ${lifetime.cost.priced.length ? 'Without a price' : 'Not priced'}: ${lifetime.cost.unpriced.map((u) => u.name).join(', ')}.`}
          </p>
          {lifetime.cost.generator && (
            <ul class="note cost-years__runs" data-testid="lifetime-fuel-runs">
              {lifetime.cost.generator.runs.map((run) => (
                <li key={run.what}>
                  Through the {run.what}: {formatSignificant(run.powerW / 1000, 4, locale)} kW, {formatSignificant(run.loadFraction * 100, 3, locale)} % of {formatSignificant(lifetime.cost.generator!.ratedPowerW / 1000, 4, locale)} kW, for{' '}
                  {formatSignificant(run.hoursPerYear, 4, locale)} h a year: {formatSignificant(run.litresPerHour, 4, locale)} L/h, {formatSignificant(run.litresPerYear, 4, locale)} L a year.
                </li>
              ))}
            </ul>
          )}
          {lifetime.cost.notes.length > 0 && (
            <ul class="note cost-years__notes" data-testid="lifetime-notes">
              {lifetime.cost.notes.map((n) => (
                <li key={n}>{n[0]!.toUpperCase() + n.slice(1)}.</li>
              ))}
            </ul>
          )}
        </>
      )}
    </section>
  );
}

const SPLIT_LABEL = 'Split the day and night hours as the load profile uses them';
const OVER_PROFILE_LABEL = "Work out the losses over the load profile's day";
const HOURS_LABEL = 'Hours per year at this load';

/** A choice the load profile offers the cost (stored as `running.<field>: true`, or left out), with its note under it. */
function ProfileChoice({ project, field, label, checked, disabled, testId, children }: { project: DraftProject; field: string; label: string; checked: boolean; disabled: boolean; testId: string; children: ComponentChildren }) {
  const help = `${testId}-help`;
  return (
    <>
      <label class="cost-years__check">
        <input
          type="checkbox"
          checked={checked}
          disabled={disabled}
          aria-describedby={help}
          onChange={(e) => writeLifetime(project, field, (e.currentTarget as HTMLInputElement).checked ? true : undefined, label)}
          data-testid={testId}
        />{' '}
        {label}
      </label>
      <p id={help} class="note">
        {children}
      </p>
    </>
  );
}

/**
 * Where the project has a duty: the backup study's load profile can split the day and night prices by the
 * energy its day uses (stored as the choice `running.dayHoursFromProfile`, worked by core); a pump duty
 * gives the hours a year (the sum of its hours; it says nothing of the time of day).
 */
function DutyHours({ project, locale }: { project: DraftProject; locale: Locale }) {
  const running = (project['running'] ?? {}) as Record<string, unknown>;
  const hasProfile = typeof project['backup'] === 'object' && project['backup'] !== null;
  const night = typeof running['nightPricePerKWh'] === 'number';
  const pumpDuty = project['pumpDuty'] as { duty?: unknown } | undefined;
  const dutyHours = pumpDuty && Array.isArray(pumpDuty.duty) && pumpDuty.duty.every((d) => typeof (d as { hours?: unknown }).hours === 'number') ? dutyHoursPerYear({ pumpDuty: pumpDuty as never }) : null;
  const hours = typeof running['hoursPerYear'] === 'number' ? running['hoursPerYear'] : null;
  if (!hasProfile && dutyHours === null) return null;
  const checked = running['dayHoursFromProfile'] === true;
  const overProfile = running['lossesFromProfile'] === true;
  return (
    <div class="cost-years__duty" data-testid="lifetime-duty">
      {hasProfile && (
        <>
          <ProfileChoice project={project} field="lossesFromProfile" label={OVER_PROFILE_LABEL} checked={overProfile} disabled={false} testId="lifetime-losses-profile">
            Each load level of the battery backup study’s day is solved through the chain and each loss counted for the time it lasts (with a night price, each stretch at its hours’ price), for the hours a year above. Unticked: the operating point shown, held all those hours.
          </ProfileChoice>
          <ProfileChoice project={project} field="dayHoursFromProfile" label={SPLIT_LABEL} checked={checked} disabled={(!night && !checked) || overProfile} testId="lifetime-split-profile">
            {overProfile
              ? 'The losses are worked out over the profile’s day (above): each stretch already pays its hours’ price.'
              : night
              ? 'The battery backup study’s day: the share of its energy used while the day price runs sets the mean price. Unticked: the hours are spread evenly over the day.'
              : 'With a night price: the battery backup study’s day can split the energy between the day and night prices.'}
          </ProfileChoice>
        </>
      )}
      {dutyHours !== null && (
        <p class="cost-years__actions">
          <button
            type="button"
            class="panel-button"
            disabled={hours === dutyHours}
            onClick={() => writeLifetime(project, 'hoursPerYear', dutyHours, HOURS_LABEL)}
            data-testid="lifetime-duty-hours"
          >
            Take the hours a year from the pump duty ({formatSignificant(dutyHours, 5, locale)} h)
          </button>
          <span class="note">The duty says how long the pump runs at each flow, not when: its hours are spread evenly over the day.</span>
        </p>
      )}
    </div>
  );
}
