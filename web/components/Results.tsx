/**
 * The solved project as tables: the energy balance, one row per element, one row per port.
 * Every number shown comes from the engine's result; this file only formats and arranges.
 */
import type { ElementResult, PortResult, SolveResult } from '../../core/result.ts';
import {
  formatApparent,
  formatCurrent,
  formatFrequency,
  formatPercent,
  formatPower,
  formatPowerFactor,
  formatReactive,
  formatSmallPercent,
  formatSpeed,
  formatVoltage,
} from '../format/number.ts';
import { elementKindLabel, portKindLabel } from '../format/labels.ts';

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

function ElementName({ element, depth, withKind = false }: { element: ElementResult; depth: number; withKind?: boolean }) {
  return (
    <span class="el-name" style={{ '--depth': String(Math.min(depth, 8)) }}>
      {depth > 0 && <span class="el-name__branch" aria-hidden="true" />}
      <span class="el-name__text">
        <span>{element.name || element.id}</span>
        {withKind && <span class="el-name__kind">{elementKindLabel(element.kind)}</span>}
      </span>
    </span>
  );
}

export function EnergyBalance({ result }: { result: SolveResult }) {
  const t = result.totals;
  return (
    <section class="balance" aria-labelledby="balance-heading" data-testid="energy-balance">
      <h3 id="balance-heading" class="visually-hidden">Energy balance</h3>
      <dl class="balance__figures">
        <div>
          <dt>Source delivers</dt>
          <dd>{formatPower(t.sourcePower)}</dd>
        </div>
        <div>
          <dt>Loads use</dt>
          <dd>{formatPower(t.loadPower)}</dd>
        </div>
        <div>
          <dt>Losses</dt>
          <dd>{formatPower(t.losses)}</dd>
        </div>
        <div>
          <dt>Chain efficiency</dt>
          <dd data-testid="chain-efficiency">{formatPercent(t.efficiency)}</dd>
        </div>
      </dl>
      <p class="balance__line" data-testid="balance-line">
        Energy balance: source {formatPower(t.sourcePower)} = loads {formatPower(t.loadPower)} + losses{' '}
        {formatPower(t.losses)}; mismatch {formatSmallPercent(t.balanceError)}.
      </p>
    </section>
  );
}

export function ElementTable({ result }: { result: SolveResult }) {
  const depth = depths(result.elements);
  const t = result.totals;
  return (
    <section aria-labelledby="elements-heading">
      <h3 id="elements-heading">Power at each element</h3>
      <div class="table-scroll" role="region" aria-labelledby="elements-heading" tabIndex={0}>
        <table class="data data--stack" data-testid="element-table">
          <thead>
            <tr>
              <th scope="col">Element</th>
              <th scope="col" class="num">P in</th>
              <th scope="col" class="num">P out</th>
              <th scope="col" class="num">Loss</th>
              <th scope="col" class="num">Efficiency</th>
            </tr>
          </thead>
          <tbody>
            {result.elements.map((e) => {
              const isLoad = e.role === 'load';
              return (
                <tr key={e.id} data-element-id={e.id}>
                  <th scope="row">
                    <ElementName element={e} depth={depth.get(e.id) ?? 0} withKind />
                  </th>
                  <td class="num">{formatPower(e.pIn)}</td>
                  <td class="num">{formatPower(e.pOut)}</td>
                  <td class="num">{isLoad ? '—' : formatPower(e.loss)}</td>
                  <td class="num">{isLoad ? '—' : formatPercent(e.efficiency)}</td>
                </tr>
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
              <td class="num" data-testid="totals-efficiency">{formatPercent(t.efficiency)}</td>
            </tr>
          </tfoot>
        </table>
      </div>
    </section>
  );
}

function portKindText(port: PortResult): string {
  const parts = [portKindLabel(port.kind)];
  if (port.frequency !== undefined && port.kind !== 'dc' && port.kind !== 'shaft') parts.push(formatFrequency(port.frequency));
  if (port.speed !== undefined) parts.push(formatSpeed(port.speed));
  return parts.join(' · ');
}

interface PortRowProps {
  element: ElementResult;
  side: 'in' | 'out';
  port: PortResult;
  depth: number;
  /** Rows the element's name cell spans (0 = this row continues the element above). */
  nameRows: number;
  /** Alternate shading per element, not per row. */
  shade: boolean;
}

function PortRow({ element, side, port, depth, nameRows, shade }: PortRowProps) {
  const electrical = port.kind !== 'shaft';
  const ac = port.kind === 'ac1' || port.kind === 'ac3';
  return (
    <tr data-element-id={element.id} data-port={side} class={`${shade ? 'shade' : ''}${nameRows === 0 ? ' cont' : ''}`}>
      {nameRows > 0 && (
        <th scope="rowgroup" rowSpan={nameRows}>
          <ElementName element={element} depth={depth} />
        </th>
      )}
      <td class="port">
        <div class="port__inner">
          <span class={`port-side port-side--${side}`}>{side}</span>
          <span class="port__kind">{portKindText(port)}</span>
        </div>
      </td>
      <td class="num" data-label="V">{electrical ? formatVoltage(port.voltage) : '—'}</td>
      <td class="num" data-label="I">{electrical ? formatCurrent(port.current) : '—'}</td>
      <td class="num" data-label="P">{formatPower(port.p)}</td>
      <td class="num" data-label="Q">{ac ? formatReactive(port.q) : '—'}</td>
      <td class="num" data-label="S">{ac ? formatApparent(port.s) : '—'}</td>
      <td class="num pf" data-label="Power factor">{ac ? formatPowerFactor(port.powerFactor, port.pfSense) : '—'}</td>
    </tr>
  );
}

export function PortTable({ result }: { result: SolveResult }) {
  const depth = depths(result.elements);
  return (
    <section aria-labelledby="ports-heading">
      <h3 id="ports-heading">Voltage, current and power at each port</h3>
      <div class="table-scroll" role="region" aria-labelledby="ports-heading" tabIndex={0}>
        <table class="data data--ports" data-testid="port-table">
          <thead>
            <tr>
              <th scope="col">Element</th>
              <th scope="col">Port</th>
              <th scope="col" class="num">V</th>
              <th scope="col" class="num">I</th>
              <th scope="col" class="num">P</th>
              <th scope="col" class="num">Q</th>
              <th scope="col" class="num">S</th>
              <th scope="col" class="num">Power factor</th>
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
                  element={e}
                  side={side}
                  port={port}
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
}

export function WarningList({ result }: { result: SolveResult }) {
  if (result.warnings.length === 0) return null;
  const names = new Map(result.elements.map((e) => [e.id, e.name || e.id]));
  return (
    <section class="notice notice--warn" aria-labelledby="warnings-heading" data-testid="warnings">
      <h3 id="warnings-heading">Check these</h3>
      <ul>
        {result.warnings.map((w, i) => (
          <li key={`${w.elementId}-${w.code}-${i}`}>
            <strong>{names.get(w.elementId) ?? w.elementId}:</strong> {w.message}
          </li>
        ))}
      </ul>
    </section>
  );
}

export function MethodNote({ result }: { result: SolveResult }) {
  const m = result.method;
  return (
    <p class="note" data-testid="method-note">
      Solved by {m.name}: {m.iterations} {m.iterations === 1 ? 'sweep' : 'sweeps'}, last relative voltage change{' '}
      {m.residual.toExponential(1)} (stops below {m.tolerance.toExponential(0)}).
    </p>
  );
}
