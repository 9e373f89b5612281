/**
 * The solved project as tables: the energy balance, one row per element, one row per port (the
 * cables' table is CableTable.tsx, re-exported here).
 * Every number shown comes from the engine's result; this file only formats and arranges.
 */
import type { ElementResult, PortResult, SolveResult } from '../../core/page.ts';
import {
  formatApparent,
  formatCurrent,
  formatFrequency,
  formatPercent,
  formatPower as formatPowerIn,
  formatPowerFactor,
  formatReactive,
  formatSmallPercent,
  formatSpeed,
  formatVoltage,
} from '../format/number.ts';
import { elementKindLabel, portKindLabel } from '../format/labels.ts';
import { formatShaftPower, type UnitSystem } from '../format/units.ts';
import { memo } from 'preact/compat';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { lagOffscreen, type BoxRef } from './lag.ts';
import { CsvButton } from './report/CsvButton.tsx';
import { messageText } from './problem-words.ts';
import { MODE_WORDS, modeOfResult } from './modes/mode-state.ts';

export { CableTable, cableLengths } from './CableTable.tsx';

/** Where a lagging part puts its ref (web/components/lag.ts). */
type Box = { box: BoxRef };

/** Tree depth of each element (for indenting names), from the `from` links the result carries. */
function depths(elements: readonly ElementResult[]): Map<string, number> {
  const byId = new Map(elements.map((e) => [e.id, e]));
  const out = new Map<string, number>();
  const depthOf = (e: ElementResult, guard = 0): number => {
    const known = out.get(e.id);
    if (known !== undefined) return known;
    const parent = e.from ? byId.get(e.from) : undefined;
    const d = parent && guard < elements.length ? depthOf(parent, guard + 1) + 1 : 0;
    out.set(e.id, d);
    return d;
  };
  elements.forEach((e) => depthOf(e));
  return out;
}

interface ElementRowProps {
  elementId: string;
  name: string;
  kind: string;
  depth: number;
  /** P in, P out, loss and efficiency, formatted. */
  cells: readonly string[];
}

function sameElementRow(a: ElementRowProps, b: ElementRowProps): boolean {
  return (
    a.elementId === b.elementId &&
    a.name === b.name &&
    a.kind === b.kind &&
    a.depth === b.depth &&
    a.cells.length === b.cells.length &&
    a.cells.every((c, i) => c === b.cells[i])
  );
}

/** One element's row; re-rendered only when a figure it shows (as formatted) has changed. */
const ElementRow = memo(function ElementRow({ elementId, name, kind, depth, cells }: ElementRowProps) {
  return (
    <tr data-element-id={elementId}>
      <th scope="row">
        <span class="el-name" style={{ '--depth': String(Math.min(depth, 8)) }}>
          {depth > 0 && <span class="el-name__branch" aria-hidden="true" />}
          <span class="el-name__text">
            <span>{name}</span>
            <span class="el-name__kind">{elementKindLabel(kind)}</span>
          </span>
        </span>
      </th>
      {cells.map((c, i) => (
        <td key={i} class="num">
          {c}
        </td>
      ))}
    </tr>
  );
}, sameElementRow);

export const ElementTable = lagOffscreen(function ElementTable({ result, twoModes, box }: { result: SolveResult; /** A project with a bank on a bus: say which mode the table shows. */ twoModes?: boolean } & Box) {
  // Read from the result shown (which lags while off screen), never from the switch: on battery the bank is the root.
  const mode = twoModes ? MODE_WORDS[modeOfResult(result)] : undefined;
  const depth = depths(result.elements);
  const t = result.totals;
  const loc = effectiveLocale();
  const units = unitSystem.value;
  const formatPower = (w: number) => formatPowerIn(w, loc);
  return (
    <section class="skip-offscreen" aria-labelledby="elements-heading">
      <h3 id="elements-heading">Power at each element</h3>
      {mode && <p class="mode-tag" data-testid="element-table-mode">{mode}</p>}
      <CsvButton name="Power at each element" />
      {/* The table itself is the lagging box: a heading showing at the screen's edge does not make the whole table render in the edit's frame. */}
      <div class="table-scroll" role="region" aria-labelledby="elements-heading" tabIndex={0} ref={box}>
        <table class="data data--stack data--fixed data--elements" data-testid="element-table">
          <thead>
            <tr>
              <th scope="col">Element</th>
              <th scope="col" class="num col-power">P in</th>
              <th scope="col" class="num col-power">P out</th>
              <th scope="col" class="num col-figure">Loss</th>
              <th scope="col" class="num col-figure">Efficiency</th>
            </tr>
          </thead>
          <tbody>
            {result.elements.map((e) => {
              const isLoad = e.role === 'load';
              return (
                <ElementRow
                  key={e.id}
                  elementId={e.id}
                  name={e.name || e.id}
                  kind={e.kind}
                  depth={depth.get(e.id) ?? 0}
                  cells={[
                    e.input?.kind === 'shaft' ? formatShaftPower(e.pIn, units, loc) : formatPower(e.pIn),
                    e.output?.kind === 'shaft' ? formatShaftPower(e.pOut, units, loc) : formatPower(e.pOut),
                    isLoad ? '—' : formatPower(e.loss),
                    isLoad ? '—' : formatPercent(e.efficiency, loc),
                  ]}
                />
              );
            })}
          </tbody>
          <tfoot>
            <tr data-testid="totals-row">
              <th scope="row">
                <span class="el-name__text">
                  <span>Whole chain</span>
                  <span class="el-name__kind">source to loads</span>
                </span>
              </th>
              <td class="num">{formatPower(t.sourcePower)}</td>
              <td class="num">{formatPower(t.loadPower)}</td>
              <td class="num">{formatPower(t.losses)}</td>
              <td class="num" data-testid="totals-efficiency">{formatPercent(t.efficiency, loc)}</td>
            </tr>
          </tfoot>
        </table>
      </div>
    </section>
  );
});

function portKindText(port: PortResult, locale: string | undefined): string {
  const parts = [portKindLabel(port.kind)];
  if (port.frequency !== undefined && port.kind !== 'dc' && port.kind !== 'shaft') parts.push(formatFrequency(port.frequency, locale));
  if (port.speed !== undefined) parts.push(formatSpeed(port.speed, locale));
  return parts.join(' · ');
}

interface PortRowProps {
  elementId: string;
  /** The element's name as shown (its id when it has none). */
  name: string;
  side: 'in' | 'out';
  /** The port as solved; formatted in the row (only when one of its figures changed). */
  port: PortResult;
  units: UnitSystem;
  locale: string | undefined;
  depth: number;
  /** Rows the element's name cell spans (0 = this row continues the element above). */
  nameRows: number;
  /** Alternate shading per element, not per row. */
  shade: boolean;
}

const PORT_LABELS = ['V', 'I', 'P', 'Q', 'S', 'Power factor'] as const;

/** The formatted cells of one port row: kind, then V, I, P, Q, S, power factor. */
function portCells(port: PortResult, units: UnitSystem, loc: string | undefined): string[] {
  const electrical = port.kind !== 'shaft';
  const ac = port.kind === 'ac1' || port.kind === 'ac3';
  return [
    portKindText(port, loc),
    electrical ? formatVoltage(port.voltage, loc) : '—',
    electrical ? formatCurrent(port.current, loc) : '—',
    electrical ? formatPowerIn(port.p, loc) : formatShaftPower(port.p, units, loc),
    ac ? formatReactive(port.q, loc) : '—',
    ac ? formatApparent(port.s, loc) : '—',
    ac ? formatPowerFactor(port.powerFactor, port.pfSense, loc) : '—',
  ];
}

/** Everything a port row shows, compared as numbers (a new solve gives new objects with the same figures). */
function samePort(a: PortResult, b: PortResult): boolean {
  return (
    a === b ||
    (a.kind === b.kind &&
      a.frequency === b.frequency &&
      a.speed === b.speed &&
      a.voltage === b.voltage &&
      a.current === b.current &&
      a.p === b.p &&
      a.q === b.q &&
      a.s === b.s &&
      a.powerFactor === b.powerFactor &&
      a.pfSense === b.pfSense)
  );
}

function samePortRow(a: PortRowProps, b: PortRowProps): boolean {
  return (
    a.elementId === b.elementId &&
    a.name === b.name &&
    a.side === b.side &&
    a.depth === b.depth &&
    a.nameRows === b.nameRows &&
    a.shade === b.shade &&
    a.units === b.units &&
    a.locale === b.locale &&
    samePort(a.port, b.port)
  );
}

/** One port's row; formatted and re-rendered only when a figure it shows has changed. */
const PortRow = memo(function PortRow({ elementId, name, side, port, units, locale, depth, nameRows, shade }: PortRowProps) {
  const cells = portCells(port, units, locale);
  return (
    <tr data-element-id={elementId} data-port={side} class={`${shade ? 'shade' : ''}${nameRows === 0 ? ' cont' : ''}`}>
      {nameRows > 0 && (
        <th scope="rowgroup" rowSpan={nameRows}>
          <span class="el-name" style={{ '--depth': String(Math.min(depth, 8)) }}>
            {depth > 0 && <span class="el-name__branch" aria-hidden="true" />}
            <span class="el-name__text">
              <span>{name}</span>
            </span>
          </span>
        </th>
      )}
      <td class="port">
        <div class="port__inner">
          <span class={`port-side port-side--${side}`}>{side}</span>
          <span class="port__kind">{cells[0]}</span>
        </div>
      </td>
      {PORT_LABELS.map((label, i) => (
        <td key={label} class={label === 'Power factor' ? 'num pf' : 'num'} data-label={label}>
          {cells[i + 1]}
        </td>
      ))}
    </tr>
  );
}, samePortRow);

export const PortTable = lagOffscreen(function PortTable({ result, twoModes, box }: { result: SolveResult; /** A project with a bank on a bus: say which mode the table shows. */ twoModes?: boolean } & Box) {
  const mode = twoModes ? MODE_WORDS[modeOfResult(result)] : undefined;
  const depth = depths(result.elements);
  const loc = effectiveLocale();
  const units = unitSystem.value;
  return (
    <section class="skip-offscreen" aria-labelledby="ports-heading">
      <h3 id="ports-heading">Voltage, current and power at each port</h3>
      {mode && <p class="mode-tag" data-testid="port-table-mode">{mode}</p>}
      <CsvButton name="Voltage, current and power at each port" />
      {/* The table itself is the lagging box: a heading showing at the screen's edge does not make the whole table render in the edit's frame. */}
      <div class="table-scroll" role="region" aria-labelledby="ports-heading" tabIndex={0} ref={box}>
        <table class="data data--ports data--fixed" data-testid="port-table">
          <thead>
            <tr>
              <th scope="col">Element</th>
              <th scope="col" class="col-port">Port</th>
              <th scope="col" class="num col-narrow">V</th>
              <th scope="col" class="num col-narrow">I</th>
              <th scope="col" class="num col-short">P</th>
              <th scope="col" class="num col-reactive">Q</th>
              <th scope="col" class="num col-short">S</th>
              <th scope="col" class="num col-pf">Power factor</th>
            </tr>
          </thead>
          <tbody>
            {result.elements.flatMap((e, index) => {
              const d = depth.get(e.id) ?? 0;
              const ports = [
                ...(e.input ? [{ side: 'in' as const, port: e.input }] : []),
                ...(e.output ? [{ side: 'out' as const, port: e.output }] : []),
              ];
              return ports.map(({ side, port }, i) => (
                <PortRow
                  key={`${e.id}-${side}`}
                  elementId={e.id}
                  name={e.name || e.id}
                  side={side}
                  port={port}
                  units={units}
                  locale={loc}
                  depth={d}
                  nameRows={i === 0 ? ports.length : 0}
                  shade={index % 2 === 1}
                />
              ));
            })}
          </tbody>
        </table>
      </div>
      <p class="note">
        AC voltages are line-to-line for three-phase and currents are line currents. Q is positive when lagging
        (inductive).
      </p>
    </section>
  );
});

export const WarningList = lagOffscreen(function WarningList({ result, twoModes, box }: { result: SolveResult; /** A project with a bank on a bus: say which mode the warnings are of. */ twoModes?: boolean } & Box) {
  if (result.warnings.length === 0) return null;
  const mode = twoModes ? MODE_WORDS[modeOfResult(result)] : undefined;
  const names = new Map(result.elements.map((e) => [e.id, e.name || e.id]));
  return (
    <section class="notice notice--warn" aria-labelledby="warnings-heading" data-testid="warnings" ref={box}>
      <h3 id="warnings-heading">Check these</h3>
      {mode && <p class="mode-tag" data-testid="warnings-mode">{mode}</p>}
      <ul>
        {result.warnings.map((w, i) => (
          <li key={`${w.elementId}-${w.code}-${i}`}>
            <strong>{names.get(w.elementId) ?? w.elementId}:</strong> {messageText(w, unitSystem.value, effectiveLocale())}
          </li>
        ))}
      </ul>
    </section>
  );
});

export const MethodNote = lagOffscreen(function MethodNote({ result, box }: { result: SolveResult } & Box) {
  const m = result.method;
  return (
    <p class="note" data-testid="method-note" ref={box}>
      Solved by {m.name}: {m.iterations} {m.iterations === 1 ? 'sweep' : 'sweeps'}, last relative voltage change{' '}
      {m.residual.toExponential(1)} (stops below {m.tolerance.toExponential(0)}).
    </p>
  );
});
