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

/** The study answers of a project with nothing to study (no bank with a study, no motor, no price). */
export const NO_STUDIES: StudyAnswers = { banks: [], starts: [], cost: { ok: false, reason: 'no energy price given', panel: 'machines' } };

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
/** True while a request is with the worker; a newer ask then waits (only the latest) instead of queueing. */
let inFlight = false;
let waitingAsk: (() => void) | null = null;
/**
 * Quick edits in a row (typing) ask once they pause: an ask within BURST_MS of the previous one waits
 * PAUSE_MS for a newer one, so the worker's studies (the battery study solves the chain at every step)
 * do not take the machine's cores from the page while the user types. An ask after a pause goes at once.
 */
const BURST_MS = 400;
const PAUSE_MS = 250;
let lastAskAt = -Infinity;
let pauseTimer: ReturnType<typeof setTimeout> | undefined;

/**
 * Ask the worker for the study answers of `solved`; the reply is kept only if no newer request was
 * made meanwhile. While one request is with the worker, only the latest newer one waits for it (quick
 * edits do not queue a study each). Without anything to study nothing is sent: readers use NO_STUDIES.
 */
export function requestStudyAnswers(solved: Solved, open: number, cost: CostSettings | null): void {
  const price = cost?.pricePerKWh ?? null;
  const hours = cost?.hoursPerYear ?? 0;
  if (asked && asked.solved === solved && asked.price === price && asked.hours === hours) return;
  asked = { solved, price, hours };
  const mine = ++ticket;
  if (!needsStudies(solved, cost)) {
    waitingAsk = null;
    if (pauseTimer !== undefined) clearTimeout(pauseTimer);
    pauseTimer = undefined;
    // Nothing to study: readers take NO_STUDIES for this pair themselves (no write, no second render).
    return;
  }
  const send = () => {
    inFlight = true;
    void askPanelWorker({ kind: 'answers', solved, cost }).then(async (reply) => {
      inFlight = false;
      const next = waitingAsk;
      waitingAsk = null;
      next?.();
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
  };
  const go = () => {
    pauseTimer = undefined;
    if (inFlight) waitingAsk = send;
    else send();
  };
  const now = performance.now();
  const inBurst = now - lastAskAt < BURST_MS;
  lastAskAt = now;
  if (pauseTimer !== undefined) clearTimeout(pauseTimer);
  // An older ask waiting for the worker is dropped: this one replaces it.
  waitingAsk = null;
  if (inBurst) pauseTimer = setTimeout(go, PAUSE_MS);
  else go();
}

/** How an entry stands for the pair on screen: current, updating (older state of this project) or none. */
export function entryState(entry: StudyAnswersEntry | null, solved: Solved, open: number): 'current' | 'updating' | 'none' {
  if (!entry || entry.open !== open) return 'none';
  return entry.solved === solved ? 'current' : 'updating';
}
