/**
 * The study answers (runtime, bank for the target, start verdicts, cost of losses) of the solved pair
 * on screen, asked of the panel worker after the paint (core/studies/answers.ts runs there). The answers
 * strip asks on every new solved pair; the strip and the chain's cards read `studyAnswers`.
 *
 * Each entry names the solved pair it was computed from: a reader shows its figures as current only
 * when that pair is the one on screen, as "updating" while a newer one is on its way for the same
 * project, and never for another project (`open`, the editor's `openCount`).
 */
import { signal } from '@preact/signals';
import type { Problem, Solved } from '../../../core/page.ts';
import type { CostSettings, StudyAnswers } from '../../../core/studies/index.ts';
import { askPanelWorker } from '../panel-client.ts';

export interface StudyAnswersEntry {
  solved: Solved;
  /** The project opening it belongs to (openCount when asked). */
  open: number;
  outcome: { ok: true; answers: StudyAnswers } | { ok: false; problems: Problem[] } | { ok: false; crash: string };
  /** Time the studies took in the worker, ms. */
  ms: number;
}

export const studyAnswers = signal<StudyAnswersEntry | null>(null);

/** Money in the locale's currency (web/format/panels.ts, loaded with the first cost answer). */
export const moneyFormat = signal<((amount: number, locale?: string) => string) | null>(null);

/** Whether the project needs the worker at all: a bank with a backup study, a motor, or a price for the cost. */
export function needsStudies(solved: Solved, cost: CostSettings | null): boolean {
  const p = solved.project;
  if (cost) return true;
  if (p.backup && p.elements.some((e) => e.kind === 'battery' && e.bank !== undefined)) return true;
  return p.elements.some((e) => e.kind === 'motor');
}

let ticket = 0;
/** The last solved pair asked about (a second ask for the same pair and cost sends nothing). */
let asked: { solved: Solved; price: number | null; hours: number } | null = null;

/**
 * Ask the worker for the study answers of `solved`; the reply is kept only if no newer request was
 * made meanwhile. Without anything to study, the entry is set at once (empty answers).
 */
export function requestStudyAnswers(solved: Solved, open: number, cost: CostSettings | null): void {
  const price = cost?.pricePerKWh ?? null;
  const hours = cost?.hoursPerYear ?? 0;
  if (asked && asked.solved === solved && asked.price === price && asked.hours === hours) return;
  asked = { solved, price, hours };
  const mine = ++ticket;
  if (!needsStudies(solved, cost)) {
    studyAnswers.value = { solved, open, outcome: { ok: true, answers: { banks: [], starts: [], cost: { ok: false, reason: 'no energy price given', panel: 'machines' } } }, ms: 0 };
    return;
  }
  void askPanelWorker({ kind: 'answers', solved, cost }).then(async (reply) => {
    if (mine !== ticket) return;
    if (reply.kind === 'answers' && reply.outcome.ok && reply.outcome.answers.cost.ok && !moneyFormat.value) {
      const m = await import('../../format/panels.ts');
      moneyFormat.value = m.formatMoney;
      if (mine !== ticket) return;
    }
    const outcome: StudyAnswersEntry['outcome'] =
      reply.kind === 'answers' ? reply.outcome : reply.kind === 'crash' ? { ok: false, crash: reply.message } : { ok: false, crash: 'unexpected reply' };
    studyAnswers.value = { solved, open, outcome, ms: reply.ms };
  });
}

/** How an entry stands for the pair on screen: current, updating (older state of this project) or none. */
export function entryState(entry: StudyAnswersEntry | null, solved: Solved, open: number): 'current' | 'updating' | 'none' {
  if (!entry || entry.open !== open) return 'none';
  return entry.solved === solved ? 'current' : 'updating';
}
