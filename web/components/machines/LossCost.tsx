/**
 * The machines panel's running cost of the losses: the energy price and hours (the user's settings) and the
 * cost per element per year.
 */
import { StudyInput } from '../StudyInput.tsx';
import { useState } from 'preact/hooks';
import type { MachinesFigures } from '../panel-worker.ts';
import { formatEnergy, formatPower, formatSignificant } from '../../format/number.ts';
import { formatForInput, parseLocaleNumber } from '../../format/parse.ts';
import { currencySymbol, formatMoney } from '../../format/panels.ts';
import { costPrefProblem, energyPrice, operatingHours } from '../../state/prefs.ts';
import { type Locale, ProblemLines } from './shared.tsx';
import { CsvButton } from '../report/CsvButton.tsx';

/** A number setting kept in the user's preferences (typed in their number format, checked by core). */
function PrefNumber({
  id,
  label,
  unit,
  value,
  onValue,
  check,
  locale,
  placeholder,
  testId,
}: {
  id: string;
  label: string;
  unit: string;
  value: number | null;
  onValue: (v: number | null) => void;
  check: (v: number) => string | null;
  locale: Locale;
  placeholder?: string;
  testId: string;
}) {
  const [text, setText] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const commit = (t: string) => {
    setText(t);
    const parsed = parseLocaleNumber(t, locale);
    if (parsed.kind === 'invalid') return setMessage(`${label}: '${t.trim()}' ${parsed.problem}`);
    if (parsed.kind === 'empty') {
      setMessage(null);
      return onValue(null);
    }
    const problem = check(parsed.value);
    if (problem) return setMessage(`${label}: ${problem}`);
    setMessage(null);
    onValue(parsed.value);
  };
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? (value === null ? '' : formatForInput(value, locale))}
      placeholder={placeholder}
      message={message}
      onText={commit}
      onLeave={() => {
        if (!message) setText(null);
      }}
      testId={testId}
    />
  );
}

export function LossCost({ lossCost, locale }: { lossCost: MachinesFigures['lossCost']; locale: Locale }) {
  const price = energyPrice.value;
  const hours = operatingHours.value;
  const symbol = currencySymbol(locale);
  const cost = price !== null ? lossCost ?? null : null;
  return (
    <section class="panel-section" aria-labelledby="loss-cost-heading" data-testid="loss-cost">
      <h4 id="loss-cost-heading">What the losses cost per year</h4>
      {cost?.ok && <CsvButton name="Yearly cost of losses" />}
      <div class="study-settings study-settings--inline">
        <PrefNumber
          id="cost-price"
          label={`Energy price${symbol ? `, ${symbol}` : ''} per kWh`}
          unit={symbol ? `${symbol}/kWh` : 'per kWh'}
          value={price}
          onValue={(v) => (energyPrice.value = v)}
          check={(v) => costPrefProblem('pricePerKWh', v)}
          locale={locale}
          placeholder="e.g. 0.25"
          testId="cost-price"
        />
        <PrefNumber
          id="cost-hours"
          label="Hours per year at this load"
          unit="h"
          value={hours}
          onValue={(v) => (operatingHours.value = v ?? 8760)}
          check={(v) => costPrefProblem('hoursPerYear', v)}
          locale={locale}
          placeholder="8760"
          testId="cost-hours"
        />
      </div>
      {!cost && <p class="note">Give your energy price to see what each stage’s loss costs a year (kept on this device, not in the project).</p>}
      {cost && !cost.ok && <ProblemLines problems={cost.problems} />}
      {cost?.ok && (
        <>
          <div class="table-scroll" role="region" aria-labelledby="loss-cost-heading" tabIndex={0}>
            <table class="data panel-table" data-testid="loss-cost-table">
              <thead>
                <tr>
                  <th scope="col">Where</th>
                  <th scope="col" class="num">Loss</th>
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
          <p class="note">At the operating point shown, held for {formatSignificant(hours, 5, locale)} h a year; a chain that runs at several loads costs what each load level costs for its hours.</p>
        </>
      )}
    </section>
  );
}
