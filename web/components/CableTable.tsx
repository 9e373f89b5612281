/**
 * The cables table: route length (from the solved project the result came from), conductor size as
 * the engine chose it, temperature, drop and loss. Every number comes from the engine; this file
 * only formats and arranges.
 */
import type { GoverningRule, Project, Solved } from '../../core/page.ts';
import { formatCurrent, formatPercent, formatPower as formatPowerIn } from '../format/number.ts';
import { formatConductorSize, formatLength, formatTemperature } from '../format/units.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { lagOffscreen, type BoxRef } from './lag.ts';
import { CsvButton } from './report/CsvButton.tsx';
import { MODE_WORDS, modeOfResult } from './modes/mode-state.ts';

/** Where a lagging part puts its ref (web/components/lag.ts). */
type Box = { box: BoxRef };

/** Why the engine chose a size, in words. */
const GOVERNING_WORDS: Record<GoverningRule, string> = {
  ampacity: 'set by ampacity',
  'voltage-drop': 'set by voltage drop',
  protection: 'set by the protective device',
  'smallest-size': 'smallest size allowed',
  fixed: 'size as given',
};

/**
 * The cables: route length (from the solved project the result came from), conductor size as the
 * engine chose it, estimated conductor temperature, voltage drop and loss. Shown only when the
 * project has cables. Takes the solved pair (lagOffscreen lags its `result` prop: here the pair), so
 * the lengths are always those of the project the figures belong to, never the draft's.
 */
export const CableTable = lagOffscreen(function CableTable({ result: solved, twoModes, box }: { result: Solved; /** A project with a bank on a bus: say which mode the table shows (the pair is that mode's). */ twoModes?: boolean } & Box) {
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const result = solved.result;
  const mode = twoModes ? MODE_WORDS[modeOfResult(result)] : undefined;
  const cables = result.elements.filter((e) => e.kind === 'cable');
  if (cables.length === 0) return null;
  const lengths = cableLengths(solved.project);
  const drops = new Map<string, number>();
  for (const path of result.voltageDrop ?? []) for (const link of path.links) drops.set(link.id, link.dropPercent);
  const cautions = [...new Set(cables.flatMap((e) => (e.conductor ? [e.conductor.caution] : [])))];
  return (
    <section class="skip-offscreen" aria-labelledby="cables-heading" data-testid="cable-panel">
      <h3 id="cables-heading">Cables</h3>
      {mode && <p class="mode-tag" data-testid="cable-table-mode">{mode}</p>}
      <CsvButton name="Cables" />
      {/* The table itself is the lagging box: a heading showing at the screen's edge does not make the whole table render in the edit's frame. */}
      <div class="table-scroll" role="region" aria-labelledby="cables-heading" tabIndex={0} ref={box}>
        <table class="data data--cables data--fixed" data-testid="cable-table">
          <thead>
            <tr>
              <th scope="col">Cable</th>
              <th scope="col" class="num col-short">Length</th>
              <th scope="col" class="col-conductor">Conductor</th>
              <th scope="col" class="num col-temperature">Conductor temp.</th>
              <th scope="col" class="num col-short">Drop</th>
              <th scope="col" class="num col-short">Loss</th>
            </tr>
          </thead>
          <tbody>
            {cables.map((e) => {
              const c = e.conductor;
              const length = lengths.get(e.id);
              const dropPercent = c ? c.drop.checkPercent : drops.get(e.id);
              return (
                <tr key={e.id} data-element-id={e.id}>
                  <th scope="row">
                    <span class="el-name__text">
                      <span>{e.name || e.id}</span>
                    </span>
                  </th>
                  <td class="num" data-label="Length" data-testid="cable-length">{length === undefined ? '—' : formatLength(length, units, locale)}</td>
                  <td class="cable-size" data-label="Conductor" data-testid="cable-size">
                    {c ? (
                      <>
                        {c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}
                        {formatConductorSize(c.size, c.areaMm2, units, locale)}
                        <span class="cell-note">
                          {c.auto ? GOVERNING_WORDS[c.governing] : 'size as given'}
                          {c.device.rating !== undefined ? ` · ${formatCurrent(c.device.rating, locale)} device` : ''} · design {formatCurrent(c.designCurrent, locale)}
                        </span>
                      </>
                    ) : (
                      <span class="cell-note">given as R and X per km</span>
                    )}
                  </td>
                  <td class="num" data-label="Conductor temp.">{c ? formatTemperature(c.resistance.operatingTemperature, units, locale) : '—'}</td>
                  <td class="num" data-label="Drop">{dropPercent === undefined ? '—' : formatPercent(dropPercent / 100, locale, 3)}</td>
                  <td class="num" data-label="Loss">{formatPowerIn(e.loss, locale)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p class="note">
        Lengths are one-way route lengths. Drop: for a sized conductor, the check by its method at the design current, % of the nominal voltage; for a cable
        given by its impedance, the solved drop, % of its sending voltage.
        {cautions.map((text) => ` ${text}`)}
      </p>
    </section>
  );
});

/** Each cable's route length, m, from a solved (valid) project. */
export function cableLengths(project: Project): Map<string, number> {
  const out = new Map<string, number>();
  for (const e of project.elements) if (e.kind === 'cable') out.set(e.id, e.length);
  return out;
}
