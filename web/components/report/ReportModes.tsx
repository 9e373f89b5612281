/**
 * The printed report's modes section for a project with a battery bank on a DC bus (issue 19), in the
 * client's words: both energy balances (on supply, on battery), the rectifier or charger for the job with
 * N+1 modules, what standing by costs a year, the moment the supply is cut (transfer), the points to check
 * and the cautions. `ReportModesMethod` is its part of the engineer's last page: the methods and the
 * figures they take (IEEE Std 946's A = L + k·C/H, E = P·t, the bank's float EMF behind its resistance);
 * `ReportModesCautions` adds the modes study's cautions to the report's own list.
 *
 * Every figure is core's runModesStudy, run in the panel worker for the mode switch (ModeResults.tsx
 * puts the reply in `modesReply`); the report shows it only for the pair it prints, and says "being
 * calculated" until it arrives. It sits in the report's head (ClientReport.tsx), after the chain, so it
 * prints where the head does (web/print.css); its own print rules are ReportModes.css. This file only formats.
 */
import type { Solved } from '../../../core/page.ts';
import type { ModesStudyResult } from '../../../core/studies/index.ts';
import { formatCurrent, formatPercent, formatPower, formatSignificant, formatSmallPercent, formatVoltage, UNIT_GAP } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';
import { modesReply } from '../modes/mode-state.ts';
import { problemLine } from '../problem-words.ts';
import './ReportModes.css';

type Locale = string | undefined;

/** The modes study of this pair, why there is none, or null while it is being calculated. */
function studyOf(solved: Solved): { study: ModesStudyResult } | { refused: string } | null {
  const r = modesReply.value;
  if (!r || r.for !== solved) return null;
  const o = r.outcome;
  if (!o.ok) return { refused: o.problems[0] ? problemLine(o.problems[0], solved.project) : 'the two modes could not be worked out' };
  if (!o.study.ok) return { refused: o.study.problems[0] ? problemLine(o.study.problems[0], solved.project) : 'the standing-by figures could not be worked out' };
  return { study: o.study.study };
}

function Balance({ title, figures, loc, testId }: { title: string; figures: ModesStudyResult['supply']; loc: Locale; testId: string }) {
  return (
    <div data-testid={testId}>
      <h3>{title}</h3>
      <dl class="report__modes-dl">
        <dt>From {figures.sourceName}</dt>
        <dd>{formatPower(figures.sourcePower, loc)}</dd>
        <dt>{figures.mode === 'supply' ? 'To the loads and the bank’s float' : 'To the loads'}</dt>
        <dd>{formatPower(figures.loadPower, loc)}</dd>
        <dt>Losses</dt>
        <dd>{formatPower(figures.losses, loc)}</dd>
        <dt>Efficiency</dt>
        <dd>{formatPercent(figures.efficiency, loc)}</dd>
      </dl>
    </div>
  );
}

/** The client's part: both balances, the charger with N+1, standing by a year, the transfer, checks and cautions. */
export function ReportModes({ solved, locale: loc }: { solved: Solved; locale: Locale }) {
  const got = studyOf(solved);
  return (
    <section class="report__modes" aria-label="On supply and on battery" data-testid="report-modes">
      <h2>On supply and on battery</h2>
      {got && 'study' in got && (
        <p>
          The bank ({got.study.bankName}) sits on the DC bus “{got.study.busName}”: on supply it floats while the supply carries the loads; on
          battery it carries them.
        </p>
      )}
      {got === null && <p data-testid="report-modes-later">The figures of the two modes are being calculated.</p>}
      {got && 'refused' in got && <p>The two modes could not be worked out: {got.refused}</p>}
      {got && 'study' in got && <ModesBody s={got.study} loc={loc} />}
    </section>
  );
}

function ModesBody({ s, loc }: { s: ModesStudyResult; loc: Locale }) {
  const c = s.charger;
  const st = s.standing;
  const t = s.transfer;
  const battery = 'ok' in s.battery ? null : s.battery;
  const A = (x: number) => formatCurrent(x, loc);
  // Kept short (run-in headings, no list per part): with the diagram it must fit the client's pages.
  return (
    <>
      <div class="report__modes-cols">
        <Balance title="On supply" figures={s.supply} loc={loc} testId="report-modes-supply" />
        {battery ? (
          <Balance title="On battery (the supply cut)" figures={battery} loc={loc} testId="report-modes-battery" />
        ) : (
          <div data-testid="report-modes-battery">
            <h3>On battery (the supply cut)</h3>
            <p>The bank cannot carry the loads: {'ok' in s.battery ? s.battery.problems[0]?.message : ''}</p>
          </div>
        )}
      </div>
      <p data-testid="report-modes-charger">
        <strong>Rectifier or charger for the job.</strong> {A(c.requiredCurrent)} needed: the loads on the bus {A(c.loadCurrent)} plus{' '}
        {A(c.rechargeCurrent)} to put {formatSignificant(c.rechargeAh, 4, loc)}{UNIT_GAP}Ah back in {formatSignificant(c.rechargeHours, 3, loc)}
        {UNIT_GAP}h.{' '}
        {c.modules && (
          <span data-testid="report-modes-modules">
            {c.modules.redundancy === 'n+1'
              ? `${c.modules.installed} modules of ${A(c.modules.moduleCurrent)}: ${c.modules.needed} needed and one spare (N+1), ${A(c.modules.installedCurrent)} installed.`
              : `${c.modules.installed} modules of ${A(c.modules.moduleCurrent)}, no spare, ${A(c.modules.installedCurrent)} installed.`}
          </span>
        )}
        {c.rechargeCase.ok && (
          <>
            {' '}While it recharges the bank the supply carries {A(c.rechargeCase.supplyCurrent)} ({formatPower(c.rechargeCase.supplyPower, loc)}): size the
            supply and its cable for this, not for the float.
          </>
        )}
      </p>
      <p data-testid="report-modes-standing">
        <strong>What standing by costs.</strong> Kept ready on supply, the system loses {formatPower(st.total, loc)} (conversion{' '}
        {formatPower(st.conversion, loc)}, idle {formatPower(st.idle, loc)}, cables {formatPower(st.cables, loc)}, the bank’s float{' '}
        {formatPower(st.bankFloat, loc)}): {formatSignificant(st.energyKWh, 4, loc)}
        {UNIT_GAP}kWh a year over {formatSignificant(st.hoursOnSupply, 4, loc)}{UNIT_GAP}h on supply ({formatSignificant(st.outageHoursPerYear, 3, loc)}
        {UNIT_GAP}h of outage expected)
        {st.cost !== undefined ? <>, costing <strong data-testid="report-modes-cost">{formatMoney(st.cost, loc)}</strong> a year.</> : '; give an energy price for its cost.'}
      </p>
      {t && (
        <p data-testid="report-modes-transfer">
          <strong>The moment the supply is cut.</strong> The bank goes from taking {A(t.floatCurrent)} on float to giving {A(t.currentAtTransfer)} (a
          step of {A(t.currentStep)}; its maximum discharge current {A(t.maxDischargeCurrent)}). The DC bus moves from{' '}
          {formatVoltage(t.busVoltageOnSupply, loc)} to {formatVoltage(t.busVoltageAtTransfer, loc)} at the cut
          {t.busVoltageSettled !== null ? <>, and settles at {formatVoltage(t.busVoltageSettled, loc)} on battery</> : ''}.
        </p>
      )}
      {s.cableSizes.length > 0 && (
        <p>
          <strong>Cables that need a larger size in one mode.</strong>{' '}
          {s.cableSizes.map((k) => `${k.name}: use ${k.use} (${k.float ?? '—'} on float, ${k.recharge ?? '—'} recharging, ${k.battery ?? '—'} on battery).`).join(' ')}
        </p>
      )}
      {s.warnings.length > 0 && (
        <p data-testid="report-modes-warnings">
          <strong>Check these.</strong> {s.warnings.map((w) => w.message).join('; ')}.
        </p>
      )}
    </>
  );
}

/**
 * The modes study's cautions, as items of the report's own cautions list (ClientReport.tsx), less the
 * planning caution the list already opens with. Nothing while the figures are being calculated.
 */
export function ReportModesCautions({ solved }: { solved: Solved }) {
  const got = studyOf(solved);
  if (!got || !('study' in got)) return null;
  return (
    <>
      {got.study.cautions
        .filter((text) => !text.startsWith('Planning estimate only'))
        .map((text) => (
          <li key={text} data-testid="report-modes-caution">
            {text}
          </li>
        ))}
    </>
  );
}

/** The engineer's page: how the two modes and their figures were worked out. */
export function ReportModesMethod({ solved, locale: loc }: { solved: Solved; locale: Locale }) {
  const got = studyOf(solved);
  if (!got || !('study' in got)) return null;
  const s = got.study;
  const c = s.charger;
  const t = s.transfer;
  const n = (x: number, d = 4) => formatSignificant(x, d, loc);
  return (
    <li data-testid="report-modes-method">
      Two modes: on supply the chain as drawn, the bank a load on its bus drawing its float current; on battery the supply branch cut
      and the chain re-rooted at the bank, solved again (energy balance mismatch {formatSmallPercent(s.supply.balanceError, loc)} on supply
      {'ok' in s.battery ? '' : `, ${formatSmallPercent(s.battery.balanceError, loc)} on battery`}). Charger: {c.method}; L = {formatCurrent(c.loadCurrent, loc)},
      k = {n(c.chargeReturnFactor, 3)} ({c.chargeReturnFactorFrom === 'typical' ? 'the chemistry’s typical value' : 'given'}), C = {n(c.rechargeAh)} Ah,
      H = {n(c.rechargeHours, 3)} h; modules n = ⌈A ÷ module⌉{c.modules?.redundancy === 'n+1' ? ' + 1 (N+1)' : ''}; the recharge case solved with the
      bank drawn as a constant current of k·C/H. Standing by: E = P·t over 8760 h less the outage hours, priced at the project’s energy
      price.{t ? ` Transfer: the bank on float holds E_f = V_float − I_float·R = ${formatVoltage(t.floatEmf, loc)} (R = ${n(t.internalResistance, 3)} Ω, Thévenin model); the on-battery chain solved from it gives the current and the bus voltage at the cut.` : ''}
    </li>
  );
}
