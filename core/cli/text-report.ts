/**
 * Plain-text tables of a solved project, for the command-line solver (pure; no Node APIs).
 */
import type { PortResult, SolveResult } from '../model/result.ts';

/** Fixed-width table with a header row; numbers right-aligned. */
function table(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: readonly string[]) =>
    cells.map((cell, i) => (i < 2 ? cell.padEnd(widths[i]!) : cell.padStart(widths[i]!))).join('  ').trimEnd();
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

/** Fixed decimals, but never more than 6 significant digits (10949.62 V prints 10949.6). */
const f = (x: number, digits = 1): string => {
  const fixed = x.toFixed(digits);
  return fixed.replace(/^-|\./g, '').replace(/^0+/, '').length > 6 && Math.abs(x) < 1e21 ? String(Number(x.toPrecision(6))) : fixed;
};
const pct = (x: number): string => `${(x * 100).toFixed(2)} %`;

function portRow(label: string, kind: string, p: PortResult): string[] {
  const pf = p.kind === 'dc' || p.kind === 'shaft' ? '—' : `${p.powerFactor.toFixed(3)} ${p.pfSense === 'unity' ? '' : p.pfSense === 'lagging' ? 'lag' : 'lead'}`.trim();
  const isShaft = p.kind === 'shaft';
  return [label, kind, isShaft ? '—' : f(p.voltage, 2), isShaft ? '—' : f(p.current, 2), f(p.p), isShaft || p.kind === 'dc' ? '—' : f(p.q), isShaft ? '—' : f(p.s), pf];
}

const KIND_LABEL: Record<PortResult['kind'], string> = { dc: 'DC', ac1: '1φ AC', ac3: '3φ AC', shaft: 'shaft' };

/** Human-readable report of a solved project. */
export function formatResult(result: SolveResult): string {
  const out: string[] = [`Project: ${result.projectName}`, ''];
  out.push('Elements (W)');
  out.push(
    table(
      ['element', 'kind', 'P in', 'P out', 'loss', 'efficiency', 'load'],
      result.elements.map((e) => [
        e.name,
        e.kind,
        f(e.pIn),
        f(e.pOut),
        f(e.loss, 2),
        e.role === 'load' ? '—' : pct(e.efficiency),
        e.loadFraction === undefined ? '—' : pct(e.loadFraction),
      ]),
    ),
  );
  out.push('', 'Interfaces (V, A, W, var, VA; three-phase V is line-to-line, I is line current)');
  const byId = new Map(result.elements.map((e) => [e.id, e]));
  const rows: string[][] = [];
  for (const e of result.elements) {
    if (e.role === 'source' && e.output) rows.push(portRow(`${e.name} (terminals)`, KIND_LABEL[e.output.kind], e.output));
    if (e.input && e.from) rows.push(portRow(`${byId.get(e.from)!.name} → ${e.name}`, KIND_LABEL[e.input.kind], e.input));
  }
  out.push(table(['interface', 'kind', 'V', 'I', 'P', 'Q', 'S', 'pf'], rows));
  const weighted = result.elements.filter((e) => e.weighted || e.fit);
  if (weighted.length) {
    out.push('', 'Converter figures');
    for (const e of weighted) {
      const parts: string[] = [];
      if (e.weighted) parts.push(`η_EURO ${pct(e.weighted.euro)}, η_CEC ${pct(e.weighted.cec)}`);
      if (e.fit) {
        parts.push(
          `loss fit P0 ${f(e.fit.p0, 2)} W, k1 ${e.fit.k1.toExponential(3)}, k2 ${e.fit.k2.toExponential(3)} /W (rms error ${f(e.fit.rmsLossError, 2)} W, max η error ${(e.fit.maxEfficiencyError * 100).toFixed(3)} points)`,
        );
      }
      out.push(`  ${e.name}: ${parts.join('; ')}`);
    }
  }
  const sized = result.elements.filter((e) => e.conductor);
  if (sized.length) {
    out.push('', 'Conductors (design I = the current the code sizes for; drop check = the method at the design current, % of nominal; solved = phasor solve at the estimated temperature)');
    out.push(
      table(
        ['cable', 'size', 'governs', 'design I', 'operating I', 'ampacity', 'device', 'drop check', 'drop solved', 'R at T', 'loss'],
        sized.map((e) => {
          const c = e.conductor!;
          const sets = c.parallelSets > 1 ? `${c.parallelSets} × ` : '';
          return [
            e.name,
            `${sets}${c.size} ${c.material === 'copper' ? 'Cu' : 'Al'}${c.auto ? '' : ' (fixed)'}`,
            c.governing,
            `${f(c.designCurrent, 1)} A`,
            `${f(c.operatingCurrent, 1)} A`,
            `${f(c.ampacity.total, 1)} A`,
            c.device.rating === undefined ? '—' : `${c.device.rating} A (${c.device.rule ?? c.device.list})`,
            `${f(c.drop.checkVolts, 2)} V ${f(c.drop.checkPercent, 2)} %`,
            `${f(c.drop.exactVolts, 2)} V ${f(c.drop.exactPercent, 2)} %`,
            `${(c.resistance.perKm).toPrecision(4)} Ω/km @ ${f(c.resistance.operatingTemperature, 0)} °C`,
            `${f(c.loss, 1)} W`,
          ];
        }),
      ),
    );
    for (const e of sized) {
      out.push('', `  ${e.name}: working`);
      for (const s of e.conductor!.steps) {
        const v = typeof s.value === 'number' ? s.value.toPrecision(4) : s.value;
        out.push(`    ${s.label}: ${v}${s.unit ? ` ${s.unit}` : ''} — ${s.note}`);
      }
    }
    out.push('', `  ${sized[0]!.conductor!.caution}`);
  }
  const paths = result.voltageDrop ?? [];
  if (paths.some((p) => p.links.length > 0)) {
    out.push('', `Voltage drop by path (limits: ${paths[0]!.limitBasis})`);
    out.push(
      table(
        ['to', 'from', 'links', 'total', 'limit', 'status'],
        paths
          .filter((p) => p.links.length > 0)
          .map((p) => [
            byId.get(p.loadId)?.name ?? p.loadId,
            byId.get(p.startId)?.name ?? p.startId,
            p.links.map((l) => `${byId.get(l.id)?.name ?? l.id} ${f(l.dropPercent, 2)} %`).join(' + '),
            `${f(p.totalPercent, 2)} %`,
            `${p.perLinkLimitPercent !== undefined ? `${p.perLinkLimitPercent} % / ` : ''}${p.totalLimitPercent} %`,
            p.exceedsLimit ? 'OVER LIMIT' : 'ok',
          ]),
      ),
    );
    out.push('  Each path starts at the source or at the nearest regulating converter, which sets the voltage afresh.');
  }
  const t = result.totals;
  out.push(
    '',
    `Source ${f(t.sourcePower)} W = loads ${f(t.loadPower)} W + losses ${f(t.losses)} W  (overall efficiency ${pct(t.efficiency)}, balance error ${t.balanceError.toExponential(1)})`,
    `Solved by ${result.method.name} in ${result.method.iterations} sweeps (tolerance ${result.method.tolerance.toExponential(0)}).`,
  );
  if (result.warnings.length) {
    out.push('', 'Warnings');
    for (const w of result.warnings) out.push(`  ${byId.get(w.elementId)?.name ?? w.elementId}: ${w.message}`);
  }
  out.push('', 'Planning estimate only: local codes and a licensed professional govern the final design.');
  return out.join('\n');
}
