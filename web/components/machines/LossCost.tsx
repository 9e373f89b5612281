/**
 * The machines panel's running cost of the losses: the energy price and hours per year (the project's
 * `running` settings, written through the engine-checked setField; a project without them starts from
 * this device's earlier setting, web/state/prefs.ts) and the cost per element per year. A value the
 * engine refuses keeps its message at the field, and the last valid cost stays, marked out of date.
 */
import type { MachinesFigures } from '../panel-worker.ts';
import { formatEnergy, formatPower, formatSignificant } from '../../format/number.ts';
import { currencySymbol, formatMoney } from '../../format/panels.ts';
import { formatForInput } from '../../format/parse.ts';
import type { UnitSystem } from '../../format/units.ts';
import { energyPrice, operatingHours, runningInForce } from '../../state/prefs.ts';
import { fieldError, setField, setFieldError, type DraftProject } from '../../state/editor.ts';
import { PROJECT_LEVEL } from '../../../core/page.ts';
import { type Locale, ProblemLines } from './shared.tsx';
import { CsvButton } from '../report/CsvButton.tsx';
import { SettingField } from '../SettingField.tsx';

/** A key of the project's `running` settings (the cost over the years writes its own through here too, web/components/cost/). */
type RunningKey = 'energyPricePerKWh' | 'hoursPerYear' | 'nightPricePerKWh' | 'dayStartHour' | 'dayEndHour' | 'years' | 'discountRate' | 'gridCo2KgPerKWh' | 'generator' | `generator.${string}`;
const PRICE_LABEL = 'Energy price per kWh';
const HOURS_LABEL = 'Hours per year at this load';

/**
 * Write one running setting. A project that has no `running` yet gets the whole object at once: the
 * value typed and the other setting as shown (carried over from this device), so what the page showed
 * is what the file then holds. The device's setting follows the last value taken (a new project starts there).
 */
export function writeRunning(project: DraftProject, key: RunningKey, value: unknown, label: string, undoWords = 'Running cost'): string | null {
  const path = `running.${key}`;
  const own = project['running'];
  let message: string | null;
  if (typeof own === 'object' && own !== null) {
    message = setField(PROJECT_LEVEL, path, value, `${undoWords}: ${label.toLowerCase()}`);
  } else {
    const shown = runningInForce(project);
    const running: Record<string, unknown> = { hoursPerYear: shown.hours };
    if (shown.price !== null) running['energyPricePerKWh'] = shown.price;
    if (value === undefined) delete running[key];
    else running[key] = value;
    message = setField(PROJECT_LEVEL, 'running', running, `${undoWords}: ${label.toLowerCase()}`);
    // The message belongs at the field typed in, not at the object.
    setFieldError(PROJECT_LEVEL, 'running', null);
    setFieldError(PROJECT_LEVEL, path, message);
  }
  if (message === null) {
    if (key === 'energyPricePerKWh') energyPrice.value = typeof value === 'number' ? value : null;
    else if (key === 'hoursPerYear') operatingHours.value = typeof value === 'number' ? value : 8760;
  }
  return message;
}

export function LossCost({ lossCost, project, units, locale }: { lossCost: MachinesFigures['lossCost']; project: DraftProject; units: UnitSystem; locale: Locale }) {
  const running = runningInForce(project);
  const { price, hours } = running;
  const symbol = currencySymbol(locale);
  const cost = price !== null ? lossCost ?? null : null;
  const refused = fieldError(PROJECT_LEVEL, 'running.energyPricePerKWh') !== undefined || fieldError(PROJECT_LEVEL, 'running.hoursPerYear') !== undefined;
  const common = { project, units, locale };
  return (
    <section class="panel-section" aria-labelledby="loss-cost-heading" data-testid="loss-cost">
      <h4 id="loss-cost-heading">What the losses cost per year</h4>
      {cost?.ok && <CsvButton name="Yearly cost of losses" />}
      <div class="study-settings study-settings--inline">
        <SettingField
          {...common}
          path="running.energyPricePerKWh"
          label={PRICE_LABEL}
          quantity="ratio"
          unit={symbol ? `${symbol}/kWh` : 'per kWh'}
          placeholder={`e.g. ${formatForInput(0.25, locale)}`}
          fallback={running.fromDevice ? price : undefined}
          help="Your tariff per kWh, in your own currency (the project keeps the number). Empty: no cost."
          write={(v) => writeRunning(project, 'energyPricePerKWh', v, PRICE_LABEL)}
          testId="cost-price"
        />
        <SettingField
          {...common}
          path="running.hoursPerYear"
          label={HOURS_LABEL}
          quantity="time"
          placeholder={formatForInput(8760, locale)}
          fallback={running.fromDevice ? hours : undefined}
          help={`${formatSignificant(8760, 4, locale)} h runs all year; a 40-hour week is about ${formatSignificant(2000, 4, locale)} h. Empty: ${formatSignificant(8760, 4, locale)} h.`}
          write={(v) => writeRunning(project, 'hoursPerYear', v, HOURS_LABEL)}
          testId="cost-hours"
        />
      </div>
      {running.fromDevice && price !== null && (
        <p class="note" data-testid="cost-from-device">
          The price and hours shown are this device’s earlier setting: the project does not hold them yet. Change either to keep them in the project and its exported file.
        </p>
      )}
      {!cost && <p class="note">Give your energy price to see what each stage’s loss costs a year (kept in the project).</p>}
      {refused && cost?.ok && (
        <p class="notice notice--stale" role="status" data-testid="loss-cost-stale">
          Out of date: the cost of the last valid price and hours. Fix the field marked above to update it.
        </p>
      )}
      {cost && !cost.ok && <ProblemLines problems={cost.problems} />}
      {cost?.ok && (
        <>
          <div class="table-scroll" role="region" aria-labelledby="loss-cost-heading" tabIndex={0}>
            <table class="data panel-table" data-testid="loss-cost-table">
              <thead>
                <tr>
                  <th scope="col">Where</th>
                  <th scope="col" class="num">{cost.cost.overProfile ? 'Mean loss' : 'Loss'}</th>
                  <th scope="col" class="num">Per year</th>
                  <th scope="col" class="num">Cost per year</th>
                </tr>
              </thead>
              <tbody>
                {cost.cost.rows.map((r) => (
                  <tr key={r.id}>
                    <th scope="row">{r.name}</th>
                    <td class="num">{formatPower(r.lossW, locale)}</td>
                    <td class="num">{formatEnergy(r.energyKWh * 1000, locale)}</td>
                    <td class="num">{formatMoney(r.cost, locale)}</td>
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr>
                  <th scope="row">All losses</th>
                  <td class="num">{formatPower(cost.cost.totalLossW, locale)}</td>
                  <td class="num">{formatEnergy(cost.cost.totalEnergyKWh * 1000, locale)}</td>
                  <td class="num" data-testid="loss-cost-total">
                    {formatMoney(cost.cost.totalCost, locale)}
                  </td>
                </tr>
              </tfoot>
            </table>
          </div>
          {cost.cost.overProfile ? (
            <p class="note" data-testid="loss-cost-over-profile">
              Worked out over the load profile’s day: {cost.cost.overProfile.states} load {cost.cost.overProfile.states === 1 ? 'level' : 'levels'}, each solved through the chain, each loss counted for the time it lasts, for {formatSignificant(hours, 5, locale)} h a year; on average {formatSignificant(cost.cost.pricePerKWh, 4, locale)} {symbol ? `${symbol}/kWh` : 'per kWh'}. The loss shown is each element’s mean over the day.
            </p>
          ) : (
            <p class="note">At the operating point shown, held for {formatSignificant(hours, 5, locale)} h a year; a chain that runs at several loads costs what each load level costs for its hours (tick “{"Work out the losses over the load profile's day"}” in the cost over the years for a project with a load profile).</p>
          )}
          {cost.cost.profileDayShare !== undefined && (
            <p class="note" data-testid="loss-cost-profile-price">
              Priced at {formatSignificant(cost.cost.pricePerKWh, 4, locale)} {symbol ? `${symbol}/kWh` : 'per kWh'}: the day and night prices split as the load profile uses its day ({formatSignificant(cost.cost.profileDayShare * 100, 3, locale)} % of its energy at the day price), the same price as the cost over the years.
            </p>
          )}
        </>
      )}
    </section>
  );
}
