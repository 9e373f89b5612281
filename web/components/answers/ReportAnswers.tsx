/**
 * The answers in the client's words, for the printed client report (ClientReport.tsx mounts it).
 *
 * Props (plain data; nothing else is read unless it is left out):
 * - `solved`: the solved pair the report prints (web/state/solution.ts `lastSolved`).
 * - `answers` (optional): `solveAnswers(solved)` from core/page.ts; computed here when left out.
 * - `studies` (optional): the study answers of the same pair (core/studies `answerStudies`); when left
 *   out, the answers strip's (`study-answers.ts`, the panel worker's) are used if they belong to this
 *   pair, and the runtime, bank, start verdicts and cost say "being calculated" until they arrive.
 * - `locale` (optional): number format; the user's by default.
 *
 * What it prints: the power delivered and used, the losses (idle, conversion, cables) and what they
 * cost a year; for a battery bank its runtime to the end of discharge, whether it meets the target,
 * the bank that does, and the current its cable and fuse are sized for (with the basis); each sized
 * cable's size, protective device and voltage drop with the requirement that set the size; each
 * motor's start verdict; the points to check (warnings). No calculation words (no "solve", "port",
 * "node", "sweep"): the method belongs on the engineer's page.
 */
import { DESIGN_BASIS_WORDS, solveAnswers, type Solved, type SolveAnswers } from '../../../core/page.ts';
import { flowGraph, type StudyAnswers } from '../../../core/studies/index.ts';
import { formatCurrent, formatDuration, formatPercent, formatPower, formatSignificant, UNIT_GAP } from '../../format/number.ts';
import { costInForce, effectiveLocale } from '../../state/prefs.ts';
import { openCount } from '../../state/editor.ts';
import { entryState, moneyFormat, needsStudies, NO_STUDIES, studyAnswers } from './study-answers.ts';
import { hoursWords } from './AnswersLines.tsx';

export interface ReportAnswersProps {
  solved: Solved;
  answers?: SolveAnswers;
  studies?: StudyAnswers | null;
  locale?: string;
}

const LATER = 'being calculated';

export function ReportAnswers({ solved, answers, studies: given, locale }: ReportAnswersProps) {
  const a = answers ?? solveAnswers(solved);
  const loc = locale ?? effectiveLocale();
  const nothingToStudy = given === undefined && !needsStudies(solved, costInForce(solved.project));
  const entry = studyAnswers.value;
  const fromStrip = nothingToStudy ? NO_STUDIES : entryState(entry, solved, openCount.value) === 'current' && entry?.outcome.ok ? entry.outcome.answers : undefined;
  const studies = given === undefined ? fromStrip : given ?? undefined;
  const l = a.losses;
  const money = moneyFormat.value;
  const cost = studies?.cost;
  const motors = solved.project.elements.filter((e) => e.kind === 'motor');
  // The element losing most (core/studies/energy-flow.ts, the diagram's own loss summary).
  const largest = flowGraph(solved.result).losses.largest;
  return (
    <section class="report-answers" aria-labelledby="report-answers-heading" data-testid="report-answers">
      <h3 id="report-answers-heading">The answers</h3>
      <ul>
        <li>
          The supply delivers <strong>{formatPower(a.source.power, loc)}</strong>; the equipment uses {formatPower(a.source.loadPower, loc)}, so{' '}
          <strong>{formatPercent(a.source.efficiency, loc)}</strong> of the energy reaches it.
        </li>
        <li data-testid="report-answers-losses">
          Losses: <strong>{formatPower(a.source.losses, loc)}</strong> — standing losses (drawn even with nothing connected) {formatPower(l.idle, loc)}, conversion{' '}
          {formatPower(l.conversion, loc)}, cables {formatPower(l.cables, loc)}
          {l.source > 0 ? `, the supply's own ${formatPower(l.source, loc)}` : ''}.{' '}
          {cost?.ok
            ? `${cost.overProfile ? 'Worked out over the load profile’s day, over' : 'Over'} ${formatSignificant(cost.hoursPerYear, 4, loc)} hours a year at ${cost.overProfile ? 'a mean of ' : ''}${formatSignificant(cost.pricePerKWh, 4, loc)} per kWh they cost about ${money ? money(cost.cost, loc) : formatSignificant(cost.cost, 4, loc)} a year.`
            : cost
              ? 'No energy price was given, so their yearly cost is not stated.'
              : `Their yearly cost: ${LATER}.`}
        </li>
        {largest && (
          <li data-testid="report-answers-largest">
            The largest single loss is in {largest.name}: {formatPower(largest.watts, loc)} ({formatPercent(largest.percent / 100, loc, 3)} of what the supply delivers)
            {largest.idleWatts > 0 ? `, of which ${formatPower(largest.idleWatts, loc)} is drawn even with no load` : ''}.
          </li>
        )}
        {a.banks.map((b) => {
          const s = studies?.banks.find((x) => x.elementId === b.elementId);
          const target = s?.targetSeconds;
          return (
            <li key={b.elementId} data-testid="report-answers-bank">
              Battery bank “{b.name}”: runtime to the end of discharge{' '}
              <strong>{s ? `${s.runtimeIsLowerBound ? 'more than ' : ''}${formatDuration(s.runtimeSeconds, loc)}` : LATER}</strong>
              {s && target !== undefined ? (s.meetsTarget ? `, which meets the ${hoursWords(target, loc)} target` : `, short of the ${hoursWords(target, loc)} target`) : ''}.
              {s?.sizedBank !== undefined && target !== undefined ? ` A bank for ${hoursWords(target, loc)}: ${s.sizedBank}.` : ''}{' '}
              {b.cableCurrent ? (
                <>
                  Its cable and fuse are sized for <strong>{formatCurrent(b.cableCurrent.amps, loc)}</strong> ({DESIGN_BASIS_WORDS[b.cableCurrent.basis]}
                  {b.cableCurrent.factor !== 1 ? ` × ${formatSignificant(b.cableCurrent.factor, 3, loc)}` : ''}
                  {b.cableCurrent.deviceRating !== undefined ? `; protective device ${formatCurrent(b.cableCurrent.deviceRating, loc)}` : ''}).
                </>
              ) : s ? (
                <>
                  Its cable and fuse must carry at least <strong>{formatCurrent(s.cableCurrent.amps, loc)}</strong>, the highest current the bank gives over the outage
                  (it rises as the voltage falls), before any allowance the local code asks for continuous use.
                </>
              ) : null}
            </li>
          );
        })}
      </ul>
      {a.cables.length > 0 && (
        <table class="data report-answers__cables" data-testid="report-answers-cables">
          <caption>Cable sizes</caption>
          <thead>
            <tr>
              <th scope="col">Cable</th>
              <th scope="col">Size</th>
              <th scope="col">Protective device</th>
              <th scope="col">Voltage drop</th>
              <th scope="col">Size set by</th>
            </tr>
          </thead>
          <tbody>
            {a.cables.map((c) => (
              <tr key={c.elementId}>
                <th scope="row">{c.name}</th>
                <td>
                  {c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}
                  {c.size}
                </td>
                <td>{c.deviceRating !== undefined ? formatCurrent(c.deviceRating, loc) : 'none in the list fits'}</td>
                <td>
                  {formatSignificant(c.dropPercent, 2, loc)}
                  {UNIT_GAP}% (limit {formatSignificant(c.dropLimitPercent, 3, loc)}
                  {UNIT_GAP}%)
                </td>
                <td>
                  {c.governingWords.replace(/^set by /, '')}; carries {formatCurrent(c.designCurrent, loc)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {motors.length > 0 && (
        <ul data-testid="report-answers-starts">
          {motors.map((m) => {
            const s = studies?.starts.find((x) => x.elementId === m.id);
            return (
              <li key={m.id}>
                Motor “{m.name ?? m.id}”: <strong>{s ? (s.verdict === 'starts' ? 'starts' : s.verdict === 'marginal' ? 'its start is marginal' : 'will not start') : LATER}</strong>
                {s && s.verdict !== 'starts' ? ` — ${s.governing}` : ''}.
              </li>
            );
          })}
        </ul>
      )}
      {a.warnings.length > 0 && (
        <p data-testid="report-answers-warnings">
          To check: {a.warnings.map((w) => `${w.name}: ${w.message}`).join(' · ')}
        </p>
      )}
    </section>
  );
}
