/**
 * The answers a solved chain gives at once (no study run): what the user opened the project for,
 * each figure with the element it belongs to, the rule or basis that set it and the panel that holds
 * its working. Pure and cheap (one pass over the result): the page computes it on every edit for
 * the answers strip. The answers that need a study (runtime, bank sizing, motor starts, cost of
 * losses) are `core/studies/answers.ts`.
 *
 * - Source power, loads, losses and chain efficiency: the solve's totals (the energy balance
 *   P_source = P_loads + P_losses, mismatch `balanceError`).
 * - Losses split (W): idle = Σ each stage's `idleLoss` (its input at zero output, core/solve/idle.ts);
 *   cables = Σ the loss of the cable elements (their I²R at the operating point); source = the
 *   source's own loss (its internal impedance); conversion = the rest (each stage's loss − its idle
 *   part: switching, copper and core loss that grow with the load). idle + conversion + cables +
 *   source = the solve's total loss exactly.
 * - Each cable with a conductor sizing: its size, device and drop (the drop checked against the limit
 *   by the code's method, `drop.checkPercent`) and the rule that set the size (`governing`).
 * - Each battery bank: the current its cable and fuse must carry and on what basis. When the cable
 *   leaving the bank has a conductor sizing, that is the sizing's design current (the current the
 *   code sizes the conductor and device for, core/conductors/design-current.ts, with the
 *   continuous-load factor where the rule applies one). Otherwise the study's highest discharge
 *   current sets it (core/studies/answers.ts): not the solve's bank current, which is at the
 *   charged bank's voltage and so below the current a constant-power load draws at the end of
 *   discharge.
 * - Each converter: its efficiency at this load (P_out / P_in of the solve).
 * - Each warning, by element name.
 */
import type { ElementKind } from '../model/project.ts';
import type { ConductorResult, DesignBasisKind, ElementResult, GoverningRule, SolveResult, WarningCode } from '../model/result.ts';
import type { Solved } from './solved.ts';

/** The panel (or results part) that holds an answer's working (web/state/working.ts names the same). */
export type WorkingPanel = 'battery' | 'conductor' | 'machines' | 'starting' | 'results';

/** The rule that set a conductor size, in words. */
export const GOVERNING_WORDS: Record<GoverningRule, string> = {
  ampacity: 'set by ampacity',
  'voltage-drop': 'set by voltage drop',
  protection: 'set by the protective device',
  'smallest-size': 'the smallest size allowed',
  fixed: 'size given by the user',
};

/** What a design current was taken from, in a few words (the full rule, with its clause, is `rule`). */
export const DESIGN_BASIS_WORDS: Record<DesignBasisKind, string> = {
  'load-nominal': 'the load at nominal voltage',
  'motor-branch': 'the motor’s full-load current',
  'motor-feeder': 'the motors’ full-load currents',
  'drive-input': 'the drive’s rated input current',
  'inverter-input': 'the inverter’s rated input current',
  'charger-output': 'the charger’s rated output current',
  'dc-dc-input': 'the converter’s rated input current',
  'dc-feeder': 'the equipment on the bus at its ratings',
  given: 'the current entered',
};

export interface LossSplit {
  /** Σ idle parts (drawn even with nothing connected), W. */
  idle: number;
  /** Σ load-dependent parts of the stages' losses, W. */
  conversion: number;
  /** Σ cable losses, W. */
  cables: number;
  /** The source's own loss, W. */
  source: number;
  /** The solve's total loss, W (= idle + conversion + cables + source). */
  total: number;
}

export interface CableAnswer {
  elementId: string;
  name: string;
  /** Size label of the table, e.g. "35 mm²", "4 AWG". */
  size: string;
  parallelSets: number;
  /** True when the engine chose the size. */
  auto: boolean;
  governing: GoverningRule;
  /** The rule that set the size, in words. */
  governingWords: string;
  /** Protective device rating, A (absent when none in the list fits). */
  deviceRating?: number;
  deviceRule?: string;
  /** Drop checked against the limit by the code's method, % of nominal. */
  dropPercent: number;
  dropLimitPercent: number;
  /** The current the code sizes conductor and device for, A. */
  designCurrent: number;
  designBasis: DesignBasisKind;
  designRule: string;
  panel: 'conductor';
}

export interface BankCableCurrent {
  /** The cable leaving the bank whose sizing sets the current. */
  cableId: string;
  cableName: string;
  /** Design current of that cable's conductor sizing, A. */
  amps: number;
  /** The current before any continuous-load factor, A, and the factor. */
  baseAmps: number;
  factor: number;
  basis: DesignBasisKind;
  /** The rule the engine names for it (design-current.ts). */
  rule: string;
  deviceRating?: number;
  panel: 'conductor';
}

export interface BankAnswer {
  elementId: string;
  name: string;
  /** The bank's current at the solved operating point (charged bank's voltage), A; 0 for a bank on a bus (it is charged there). */
  operatingCurrent: number;
  /** The bank sits on a DC bus inside a chain fed from the supply: the solved chain is the on-supply mode, its figures on battery come from the studies. */
  onBus?: true;
  /** The first cable below the bank, when there is one (sized or not). */
  cableId?: string;
  cableName?: string;
  /** Set when that cable has a conductor sizing: the current its cable and fuse must carry. */
  cableCurrent?: BankCableCurrent;
}

export interface ConverterAnswer {
  elementId: string;
  kind: ElementKind;
  /** P_out / P_in at this load. */
  efficiency: number;
  /** P_out / rated, when the stage has a rating. */
  loadFraction?: number;
}

export interface WarningAnswer {
  elementId: string;
  name: string;
  code: WarningCode;
  message: string;
}

export interface SolveAnswers {
  source: { elementId: string; name: string; kind: ElementKind; power: number; loadPower: number; losses: number; efficiency: number; balanceError: number };
  losses: LossSplit;
  banks: BankAnswer[];
  cables: CableAnswer[];
  converters: ConverterAnswer[];
  warnings: WarningAnswer[];
}

/** Kinds whose efficiency a card shows (they convert or transform; cables and buses only lose). */
const CONVERTERS: ReadonlySet<ElementKind> = new Set<ElementKind>(['inverter', 'rectifier', 'dc-dc', 'generic', 'drive', 'transformer']);

function cableAnswer(e: ElementResult, c: ConductorResult): CableAnswer {
  return {
    elementId: e.id,
    name: e.name,
    size: c.size,
    parallelSets: c.parallelSets,
    auto: c.auto,
    governing: c.governing,
    governingWords: GOVERNING_WORDS[c.governing],
    ...(c.device.rating !== undefined ? { deviceRating: c.device.rating } : {}),
    ...(c.device.rule !== undefined ? { deviceRule: c.device.rule } : {}),
    dropPercent: c.drop.checkPercent,
    dropLimitPercent: c.drop.limitPercent,
    designCurrent: c.designCurrent,
    designBasis: c.designBasis.basis,
    designRule: c.designBasis.rule,
    panel: 'conductor',
  };
}

/** The first cable below a bank: its direct child of kind cable (the bank's output circuit), if any. */
function bankCable(bank: ElementResult, byId: ReadonlyMap<string, ElementResult>): ElementResult | undefined {
  for (const id of bank.feeds) {
    const child = byId.get(id);
    if (child?.kind === 'cable') return child;
  }
  return undefined;
}

/** Answers of a solved result, kept per result (the strip asks again for the same result on a re-render). */
const known = new WeakMap<SolveResult, SolveAnswers>();

/** The answers the solve itself gives (see the file's top). One pass over the result. */
export function solveAnswers(solved: Pick<Solved, 'result'>): SolveAnswers {
  const result = solved.result;
  const cached = known.get(result);
  if (cached) return cached;
  const byId = new Map(result.elements.map((e) => [e.id, e]));
  const names = (id: string) => byId.get(id)?.name ?? id;
  let idle = 0;
  let conversion = 0;
  let cables = 0;
  let sourceLoss = 0;
  const banks: BankAnswer[] = [];
  const cableAnswers: CableAnswer[] = [];
  const converters: ConverterAnswer[] = [];
  const source = result.elements.find((e) => e.role === 'source') ?? result.elements[0]!;
  for (const e of result.elements) {
    if (e.role === 'source') sourceLoss += e.loss;
    else if (e.kind === 'cable') cables += e.loss;
    else {
      const i = e.idleLoss ?? 0;
      idle += i;
      conversion += e.loss - i;
    }
    if (e.conductor) cableAnswers.push(cableAnswer(e, e.conductor));
    if (CONVERTERS.has(e.kind)) converters.push({ elementId: e.id, kind: e.kind, efficiency: e.efficiency, ...(e.loadFraction !== undefined ? { loadFraction: e.loadFraction } : {}) });
    if (e.kind === 'battery') {
      const cable = bankCable(e, byId);
      const c = cable?.conductor;
      banks.push({
        elementId: e.id,
        name: e.name,
        operatingCurrent: e.output?.current ?? 0,
        ...(e.role !== 'source' ? { onBus: true as const } : {}),
        ...(cable ? { cableId: cable.id, cableName: cable.name } : {}),
        ...(cable && c
          ? {
              cableCurrent: {
                cableId: cable.id,
                cableName: cable.name,
                amps: c.designCurrent,
                baseAmps: c.designBasis.baseCurrent,
                factor: c.designBasis.factor,
                basis: c.designBasis.basis,
                rule: c.designBasis.rule,
                ...(c.device.rating !== undefined ? { deviceRating: c.device.rating } : {}),
                panel: 'conductor' as const,
              },
            }
          : {}),
      });
    }
  }
  const t = result.totals;
  const answers: SolveAnswers = {
    source: { elementId: source.id, name: source.name, kind: source.kind, power: t.sourcePower, loadPower: t.loadPower, losses: t.losses, efficiency: t.efficiency, balanceError: t.balanceError },
    losses: { idle, conversion, cables, source: sourceLoss, total: t.losses },
    banks,
    cables: cableAnswers,
    converters,
    warnings: result.warnings.map((w) => ({ elementId: w.elementId, name: names(w.elementId), code: w.code, message: w.message })),
  };
  known.set(result, answers);
  return answers;
}
