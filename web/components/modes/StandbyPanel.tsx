/**
 * "Standing by and transfer": the modes study of a project with a battery bank on a DC bus (issue 19,
 * core's runModesStudy, run in the panel worker for the mode switch: ModeResults.tsx asks, `modesReply`
 * holds the reply, this panel reads it): its settings (`standby`: recharge time, module current,
 * redundancy, outage hours), the charger sizing (IEEE Std 946, A = L + k·C/H, modules with N+1), the
 * standing losses on supply and their yearly cost, the transfer figures, the cables each case sizes, the
 * warnings, which mode each study used and the cautions. Every figure is core's; this file only formats.
 * Loaded on demand when its panel is opened (PanelShelf.tsx).
 */
import { fieldLabel, type Problem } from '../../../core/page.ts';
import type { ModesStudyResult } from '../../../core/studies/index.ts';
import { formatCurrent, formatPercent, formatPower, formatSignificant, formatVoltage } from '../../format/number.ts';
import { formatMoney } from '../../format/panels.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { draft, getAt, lastSolved, openCount, resultsState, type DraftProject } from '../../state/editor.ts';
import { modesCrash, modesReply } from './mode-state.ts';
import { problemLine, messageText } from '../problem-words.ts';
import { SettingField } from '../SettingField.tsx';
import { ChoiceField } from '../ChoiceField.tsx';
import type { Quantity } from '../../format/parse.ts';
import '../Panels.css';

type Locale = string | undefined;

function Problems({ problems, project }: { problems: Problem[]; project: unknown }) {
  return (
    <div role="alert">
      <ul class="panel-warnings">
        {problems.map((p, i) => <li key={i}>{problemLine(p, project)}</li>)}
      </ul>
    </div>
  );
}

/** The project's own fields' labels (core/model/field-labels.ts, the `project` table). */
const label = (path: string) => fieldLabel('project', path);

/**
 * Where the charge to put back came from, in words (core's `rechargeAhFrom`: given, or what it takes
 * without a value). A source core adds later is shown as core words it.
 */
function rechargeAhFromWords(from: string): string {
  if (from === 'given') return 'given';
  if (from === 'bank capacity') return 'the bank’s rated capacity';
  if (from === 'backup study' || /drawn|outage/.test(from)) return 'the charge the outage drew in the battery backup study';
  return from;
}

/** What a setting's placeholder and help read: the number format and core's charger working, when in. */
interface SettingContext {
  n: (x: number, digits?: number) => string;
  c: ModesStudyResult['charger'] | undefined;
}

/**
 * The `standby` settings, one row each: the path (its label is the project table's, its unit the
 * quantity's), what an empty field takes, the typical value and why with its usual range, and the test id.
 */
type StandbySetting =
  | { type: 'number'; path: string; quantity: Quantity; placeholder: (x: SettingContext) => string | undefined; help: (x: SettingContext) => string; testId: string }
  | { type: 'choice'; path: string; options: readonly { value: string; label: string }[]; shown: (stored: unknown) => string; help: string; testId: string };

const STANDBY_SETTINGS: readonly StandbySetting[] = [
  {
    type: 'number',
    path: 'standby.targetRechargeHours',
    quantity: 'time',
    placeholder: ({ n }) => n(8, 3),
    help: () => 'Typically 8 to 12 h for a standby lead-acid plant; a short time needs a larger charger. Empty: 8 h.',
    testId: 'standby-recharge-hours',
  },
  {
    type: 'number',
    path: 'standby.rechargeAh',
    quantity: 'capacity',
    placeholder: ({ n, c }) => (c && c.rechargeAhFrom !== 'given' ? n(c.rechargeAh) : undefined),
    help: ({ n, c }) =>
      `The ampere-hours the charger must put back after an outage: what the outage takes out, at most the bank’s rated capacity.${
        c && c.rechargeAhFrom !== 'given' ? ` Empty: ${n(c.rechargeAh)} Ah, ${rechargeAhFromWords(c.rechargeAhFrom)}.` : ' Empty: what the study takes without it (shown in the working below).'
      }`,
    testId: 'standby-recharge-ah',
  },
  {
    type: 'number',
    path: 'standby.chargeReturnFactor',
    quantity: 'ratio',
    placeholder: ({ n, c }) => (c && c.chargeReturnFactorFrom === 'typical' ? n(c.chargeReturnFactor, 3) : undefined),
    help: ({ n, c }) =>
      `Charge put back per charge taken out, typically ${n(1.05, 3)} to ${n(1.4, 3)} (IEEE Std 946, makers’ data): the charging losses; typical value: use the maker’s figure.${
        c && c.chargeReturnFactorFrom === 'typical' ? ` Empty: ${n(c.chargeReturnFactor, 3)}, the bank’s chemistry’s typical factor.` : ' Empty: the bank’s chemistry’s typical factor.'
      }`,
    testId: 'standby-charge-return',
  },
  {
    type: 'number',
    path: 'standby.moduleCurrent',
    quantity: 'current',
    placeholder: () => 'e.g. 25',
    help: () => 'One rectifier or charger module’s rated output: use the maker’s figure. Empty: no module count.',
    testId: 'standby-module-current',
  },
  {
    type: 'choice',
    path: 'standby.redundancy',
    options: [
      { value: 'n+1', label: 'One spare module (N+1)' },
      { value: 'none', label: 'None' },
    ],
    // What core takes without a value: N+1.
    shown: (stored) => (stored === 'none' ? 'none' : 'n+1'),
    help: 'N+1 is usual where the loads must stay up while a module is changed or fails.',
    testId: 'standby-redundancy',
  },
  {
    type: 'number',
    path: 'standby.outageHoursPerYear',
    quantity: 'time',
    placeholder: () => '0',
    help: () => 'Your own estimate or the network’s record: a few hours a year is common on a town supply. Empty: 0 h.',
    testId: 'standby-outage-hours',
  },
];

/** The `standby` settings, each with its typical value and why under it (written through setField). */
function StandbySettings({ project, locale, study }: { project: DraftProject; locale: Locale; study: ModesStudyResult | null }) {
  const units = unitSystem.value;
  const x: SettingContext = { n: (v, d = 4) => formatSignificant(v, d, locale), c: study?.charger };
  return (
    <div class="study-settings" data-testid="standby-settings">
      {STANDBY_SETTINGS.map((s) =>
        s.type === 'number' ? (
          <SettingField key={s.path} project={project} units={units} locale={locale} path={s.path} label={label(s.path)} quantity={s.quantity} placeholder={s.placeholder(x)} help={s.help(x)} testId={s.testId} />
        ) : (
          <ChoiceField key={s.path} path={s.path} label={label(s.path)} value={s.shown(getAt(project, s.path))} options={s.options} help={s.help} testId={s.testId} />
        ),
      )}
    </div>
  );
}

function Figures({ s, locale }: { s: ModesStudyResult; locale: Locale }) {
  const c = s.charger;
  const st = s.standing;
  const t = s.transfer;
  const A = (x: number) => formatCurrent(x, locale);
  const W = (x: number) => formatPower(x, locale);
  const V = (x: number) => formatVoltage(x, locale);
  const n = (x: number, d = 4) => formatSignificant(x, d, locale);
  const units = unitSystem.value;
  return (
    <>
      <section class="panel-section standby" aria-labelledby="standby-charger-heading" data-testid="standby-charger">
        <h4 id="standby-charger-heading">Rectifier or charger for the job (on supply, recharging)</h4>
        <p class="note">
          {c.method}: the load on the bus plus the current that puts the charge back in the target time.
          {c.chargerName ? ` Charger: ${c.chargerName}.` : ''}
        </p>
        <dl>
          <dt>Load on the bus, L</dt><dd data-testid="standby-load-current">{A(c.loadCurrent)}</dd>
          <dt>Charge to put back, C ({rechargeAhFromWords(c.rechargeAhFrom)})</dt><dd data-testid="standby-recharge-ah-used">{n(c.rechargeAh)} Ah</dd>
          <dt>Recharge time, H</dt><dd>{n(c.rechargeHours, 3)} h</dd>
          <dt>Charge-return factor, k{c.chargeReturnFactorFrom === 'typical' ? ' (typical value: use the maker’s figure)' : ''}</dt><dd data-testid="standby-charge-return-used">{n(c.chargeReturnFactor, 3)}</dd>
          <dt>Recharge current, k·C/H</dt><dd data-testid="standby-recharge-current">{A(c.rechargeCurrent)}</dd>
          <dt>Capacity needed, A</dt><dd data-testid="standby-required-current">{A(c.requiredCurrent)}</dd>
          {c.modules && (
            <>
              <dt>Modules of {A(c.modules.moduleCurrent)}</dt>
              <dd data-testid="standby-modules">
                {c.modules.needed} needed{c.modules.redundancy === 'n+1' ? `, ${c.modules.installed} with N+1` : ''}
              </dd>
              <dt>Installed</dt><dd>{A(c.modules.installedCurrent)}</dd>
            </>
          )}
          <dt>Supply power on float (on supply)</dt><dd data-testid="standby-supply-power">{W(s.supply.sourcePower)}</dd>
          {c.rechargeCase.ok && (
            <>
              <dt>Supply current while recharging (size the supply for this)</dt><dd data-testid="standby-supply-current">{A(c.rechargeCase.supplyCurrent)}</dd>
              <dt>Supply power while recharging</dt><dd>{W(c.rechargeCase.supplyPower)}</dd>
            </>
          )}
        </dl>
        {!c.modules && <p class="note">Give the module current above to count the modules.</p>}
        {c.rechargeCase.ok && c.rechargeCase.cables.length > 0 && (
          <ul class="panel-list" data-testid="standby-recharge-cables">
            {c.rechargeCase.cables.map((k) => (
              <li key={k.id}>{k.name}: {A(k.current)}{k.size ? `, ${k.size}` : ''}</li>
            ))}
          </ul>
        )}
        {!c.rechargeCase.ok && <Problems problems={c.rechargeCase.problems} project={draft.value} />}
      </section>

      <section class="panel-section standby" aria-labelledby="standby-cost-heading" data-testid="standby-cost">
        <h4 id="standby-cost-heading">What standing by costs (on supply)</h4>
        <dl>
          <dt>Conversion</dt><dd>{W(st.conversion)}</dd>
          <dt>Idle draw</dt><dd>{W(st.idle)}</dd>
          <dt>Cables</dt><dd>{W(st.cables)}</dd>
          <dt>Supply’s own</dt><dd>{W(st.source)}</dd>
          <dt>The bank’s float</dt><dd>{W(st.bankFloat)}</dd>
          <dt>Standing losses</dt><dd data-testid="standby-losses">{W(st.total)}</dd>
          <dt>Hours a year on supply ({n(st.outageHoursPerYear, 3)} h of outage expected)</dt><dd>{n(st.hoursOnSupply)} h</dd>
          <dt>Energy a year</dt><dd data-testid="standby-energy">{n(st.energyKWh)} kWh</dd>
          {st.cost !== undefined && (
            <>
              <dt>Cost a year</dt><dd data-testid="standby-cost-year">{formatMoney(st.cost, locale)}</dd>
            </>
          )}
        </dl>
        {st.cost === undefined && <p class="note">Give your energy price (in the running cost panel) to see what standing by costs a year.</p>}
      </section>

      {t && (
        <section class="panel-section standby" aria-labelledby="standby-transfer-heading" data-testid="standby-transfer">
          <h4 id="standby-transfer-heading">Transfer: the moment the supply is cut</h4>
          <dl>
            <dt>Bank current on float (in; {t.floatCurrentNote})</dt><dd>{A(t.floatCurrent)}</dd>
            <dt>Bank current just after the cut (out)</dt><dd data-testid="standby-transfer-current">{A(t.currentAtTransfer)}</dd>
            <dt>Current step</dt><dd data-testid="standby-current-step">{A(t.currentStep)}</dd>
            <dt>The bank’s maximum discharge current</dt><dd>{A(t.maxDischargeCurrent)}</dd>
            <dt>Bus voltage on supply</dt><dd>{V(t.busVoltageOnSupply)}</dd>
            <dt>Bus voltage at the cut</dt><dd data-testid="standby-bus-transfer">{V(t.busVoltageAtTransfer)}</dd>
            {t.busVoltageSettled !== null && (
              <>
                <dt>Bus voltage settled on battery</dt><dd>{V(t.busVoltageSettled)}</dd>
              </>
            )}
          </dl>
        </section>
      )}

      {s.cableSizes.length > 0 && (
        <section class="panel-section" aria-labelledby="standby-cables-heading" data-testid="standby-cables">
          <h4 id="standby-cables-heading">Cables sized differently on float, recharging and on battery</h4>
          <ul class="panel-list">
            {s.cableSizes.map((k) => (
              <li key={k.id}>
                {k.name}: {k.float ?? '—'} on float, {k.recharge ?? '—'} recharging, {k.battery ?? '—'} on battery: use {k.use}
              </li>
            ))}
          </ul>
        </section>
      )}

      {s.warnings.length > 0 && (
        <section class="notice notice--warn" aria-labelledby="standby-warnings-heading" data-testid="standby-warnings">
          <h4 id="standby-warnings-heading">Check these</h4>
          <ul>{s.warnings.map((w, i) => <li key={i}>{messageText(w, units, locale)}</li>)}</ul>
        </section>
      )}

      <section class="panel-section" aria-labelledby="standby-modes-heading" data-testid="standby-which-mode">
        <h4 id="standby-modes-heading">Which mode each study uses</h4>
        <ul class="panel-list">
          <li>Balance on supply: {W(s.supply.sourcePower)} from {s.supply.sourceName}, efficiency {formatPercent(s.supply.efficiency, locale)}.</li>
          <li>The charger sizing and the cost of standing by: on supply (the charger sizing while recharging).</li>
          <li>The transfer: the moment between the two modes.</li>
          <li>The battery backup study: on battery. The other studies (conductor sizing, machines, starting and fault current): on supply, the chain as drawn.</li>
        </ul>
      </section>
    </>
  );
}

export default function StandbyPanel() {
  const project = draft.value;
  const solved = lastSolved.value;
  const locale = effectiveLocale();
  // The mode switch (ModeResults.tsx), shown with the results whenever this panel is, asks the panel worker
  // for the modes of the same solved pair and keeps the reply in `modesReply`: the panel reads that one
  // request. The same project's older reply stays shown while the new one is worked out (as before).
  const shared = modesReply.value;
  const reply = shared && (shared.for === solved || (shared.open !== undefined && shared.open === openCount.value)) ? shared : null;
  const pending = reply?.for !== solved;
  const crash = modesCrash.value?.for === solved ? modesCrash.value.message : null;
  const stale = resultsState.value === 'stale';
  const outcome = reply?.outcome ?? null;
  const study = outcome?.ok ? outcome.study : null;
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="standby-panel" data-state={study?.ok ? 'ready' : pending ? 'working' : 'none'}>
      {project && <StandbySettings project={project} locale={locale} study={study?.ok ? study.study : null} />}
      {crash && <p class="notice notice--error" role="alert">{crash}</p>}
      {!reply && !crash && <p class="note" role="status">Working out the two modes…</p>}
      {outcome && !outcome.ok && <Problems problems={outcome.problems} project={project} />}
      {study && !study.ok && <Problems problems={study.problems} project={project} />}
      {study?.ok && <Figures s={study.study} locale={locale} />}
      {study?.ok && (
        <section class="panel-section panel-cautions" aria-labelledby="standby-cautions-heading" data-testid="standby-cautions">
          <h4 id="standby-cautions-heading">Before you rely on these figures</h4>
          <ul>
            {study.study.cautions.map((c, i) => <li key={i}>{c}</li>)}
            <li>Local electrical codes and licensed professional practice govern the charger, the bank, its protection and its cables.</li>
          </ul>
        </section>
      )}
    </div>
  );
}
