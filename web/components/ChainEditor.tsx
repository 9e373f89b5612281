/**
 * The chain editor: the open project's chain as a flow of stage cards from the source to the loads,
 * with branches stacked; under the cards, for the selected card only, a toolbar of the chain
 * operations that fit it (chain/tools.ts: add after, add a branch, remove on the toolbar; insert
 * before, duplicate, move, reorder, remove branch in its "More" menu), then the selected stage's
 * form; undo and redo beside the heading. Every change goes through web/state/editor.ts; refusals are shown in a
 * polite status line.
 *
 * Keyboard: the cards are one composite widget with a roving tabindex. Tab enters the chain at the
 * selected (or first) card; Left/Right go upstream/downstream, Up/Down between sibling branches,
 * Home/End to the source/last card; Enter or Space selects and moves into the form; Delete removes
 * (undo available). Ctrl/Cmd+Z undoes, Ctrl/Cmd+Shift+Z or Ctrl+Y redoes (not while typing in a
 * text field, where the browser's own undo applies).
 */
import { useSignal } from '@preact/signals';
import { memo } from 'preact/compat';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef } from 'preact/hooks';
import type { ComponentChildren } from 'preact';
import type { ElementKind, ElementResult, SolveResult } from '../../core/page.ts';
import { nominalPorts, offeredTemplates, type AddOperation, type FeedingPort } from '../editor/templates.ts';
import { elementKindLabel } from '../format/labels.ts';
import {
  addBranch,
  canRedo,
  canUndo,
  draft,
  draftProblems,
  duplicate,
  elementName,
  insertAfter,
  insertBefore,
  lastChange,
  roomForElements,
  lastSolved,
  moveDownstream,
  moveUpstream,
  redo,
  redoLabel,
  removeBranch,
  removeElement,
  reorderBranch,
  resultsState,
  rootOf,
  selectedId,
  undo,
  undoLabel,
  type DraftElement,
  type DraftProject,
  type OperationOutcome,
} from '../state/editor.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { keyInputs, StageCard } from './StageCard.tsx';
import { useOffscreenLag, type BoxRef } from './lag.ts';
import { StageForm } from './StageForm.tsx';
import { ADD_WORDS, MoreMenu, NOTHING_OFFERED, TOOL_WORDS, type ToolAction, ToolButton } from './chain/Toolbar.tsx';
import { addBankOnBus, fittingActions, PRIMARY_ACTIONS } from './chain/tools.ts';
import { layoutOf, neighbour } from './chain/card-layout.ts';
import './ChainEditor.css';

function isTextEntry(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  if (target instanceof HTMLTextAreaElement || target instanceof HTMLSelectElement) return true;
  if (target instanceof HTMLInputElement) return !['button', 'checkbox', 'radio', 'submit', 'reset', 'file', 'range', 'color'].includes(target.type);
  return false;
}

// ---------- the editor ----------

/**
 * The editor follows the draft and the results; scrolled out of view (an undo from the keyboard
 * while the diagram is shown, say), its cards follow them when the page is idle (lag.ts), and the
 * view below is not even compared again until then. The stage form follows the draft itself.
 */
export function ChainEditor() {
  const latest = draft.value;
  const latestResult = lastSolved.value?.result ?? null;
  const now = useMemo(() => ({ p: latest, result: latestResult }), [latest, latestResult]);
  const { box, shown } = useOffscreenLag(now);
  return <ChainEditorView p={shown.p} result={shown.result} box={box} />;
}

const ChainEditorView = memo(function ChainEditorView({
  p,
  result,
  box,
}: {
  p: DraftProject | null;
  result: SolveResult | null;
  box: BoxRef;
}) {
  const focusId = useSignal<string | null>(null);
  const chooser = useSignal<{ op: AddOperation; target: string } | null>(null);
  const refused = useSignal<string | null>(null);
  /** A hint added to the status line, for the change it was given with. */
  const hint = useSignal<{ change: string; text: string } | null>(null);
  const pendingFocus = useRef<string | 'form' | 'chooser' | null>(null);
  const root = useRef<HTMLElement | null>(null);
  const rootRef = useCallback((el: HTMLElement | null) => {
    root.current = el;
    box(el);
  }, [box]);
  const formRef = useRef<HTMLElement>(null);
  const chooserOpener = useRef<HTMLElement | null>(null);
  // The cards' handlers keep one identity across renders (the cards are memo'd: an edit re-renders
  // only the cards whose text changed); they call the handler of the latest render.
  const selectRef = useRef<(id: string, how: 'pointer' | 'keyboard') => void>(() => {});
  const onCardSelect = useCallback((id: string, how: 'pointer' | 'keyboard') => selectRef.current(id, how), []);
  // The toolbar's buttons likewise (memo'd): one handler that carries out the latest render's action.
  const actRef = useRef<(action: ToolAction, opener: HTMLElement | null) => void>(() => {});
  const onAct = useCallback((action: ToolAction, opener: HTMLElement | null) => actRef.current(action, opener), []);
  const onCardFocus = useCallback((fid: string) => {
    focusId.value = fid;
  }, [focusId]);

  // Undo and redo from the keyboard, anywhere on the page except while typing in a text field.
  useEffect(() => {
    const onKey = (ev: KeyboardEvent) => {
      if (!(ev.ctrlKey || ev.metaKey) || ev.altKey || isTextEntry(ev.target)) return;
      const key = ev.key.toLowerCase();
      if (key === 'z' && !ev.shiftKey) {
        ev.preventDefault();
        if (canUndo.value) undo();
      } else if ((key === 'z' && ev.shiftKey) || (key === 'y' && ev.ctrlKey && !ev.shiftKey)) {
        ev.preventDefault();
        if (canRedo.value) redo();
      }
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, []);

  // Move focus where the last action asked, once the cards are drawn: before the browser paints, so a
  // key pressed as soon as the chooser shows (Escape) already reaches it, not the button that opened it.
  useLayoutEffect(() => {
    const want = pendingFocus.current;
    if (!want || !root.current) return;
    pendingFocus.current = null;
    if (want === 'form') {
      const form = formRef.current;
      const first = form?.querySelector<HTMLElement>('input, select, textarea, button, [tabindex="0"]');
      (first ?? form)?.focus();
    } else if (want === 'chooser') {
      root.current.querySelector<HTMLElement>('.kind-chooser button')?.focus();
    } else {
      root.current.querySelector<HTMLElement>(`[data-card-id="${CSS.escape(want)}"]`)?.focus();
    }
  });

  // The selected card's fitting operations, worked out again only when the selection, the chain's shape
  // (ids, feeders, kinds) or a nominal port changes, not at every keystroke in a name or a rating (they
  // cost up to 1 ms on a demo; the chooser itself is worked out afresh when opened).
  const ports = useMemo(() => (p ? nominalPorts(p) : new Map<string, FeedingPort>()), [p]);
  const selectedNow = selectedId.value;
  const fitKey = p && selectedNow !== null ? `${p.elements.map((e) => `${e.id}<${e.from ?? ''}:${e.kind}`).join('|')}#${JSON.stringify([...ports])}` : '';
  const fitting = useMemo(() => (p && selectedNow !== null ? fittingActions(p, selectedNow) : []), [fitKey, selectedNow]);

  if (!p) return null;
  const layout = layoutOf(p);
  const byId = new Map(p.elements.map((e) => [e.id, e]));
  const results = new Map<string, ElementResult>((result?.elements ?? []).map((r) => [r.id, r]));
  const stale = resultsState.value === 'stale';
  const problemCount = new Map<string, number>();
  for (const pr of draftProblems.value) problemCount.set(pr.elementId, (problemCount.get(pr.elementId) ?? 0) + 1);
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const selected = selectedId.value !== null && byId.has(selectedId.value) ? selectedId.value : null;
  const firstId = layout.order[0] ?? layout.loose[0] ?? null;
  const active = (focusId.value && byId.has(focusId.value) ? focusId.value : null) ?? selected ?? firstId;

  /** Run a chain operation; a refusal is kept to be shown as such. */
  const run = (op: () => OperationOutcome, focusAfter?: 'selected') => {
    const r = op();
    refused.value = r.ok ? null : r.message;
    hint.value = null;
    if (r.ok && focusAfter === 'selected' && selectedId.value) {
      focusId.value = selectedId.value;
      pendingFocus.current = selectedId.value;
    }
    return r;
  };

  const select = (id: string, how: 'pointer' | 'keyboard') => {
    selectedId.value = id;
    focusId.value = id;
    chooser.value = null;
    if (how === 'keyboard') pendingFocus.current = 'form';
  };
  selectRef.current = select;

  actRef.current = (action, opener) => {
    if (action === 'undo') return void undo();
    if (action === 'redo') return void redo();
    if (action === 'after' || action === 'branch' || action === 'before') return openChooser(action, opener);
    if (!selected) return;
    const ops = {
      duplicate: () => duplicate(selected),
      upstream: () => moveUpstream(selected),
      downstream: () => moveDownstream(selected),
      branchUp: () => reorderBranch(selected, -1),
      branchDown: () => reorderBranch(selected, 1),
      remove: () => removeElement(selected),
      removeBranch: () => removeBranch(selected),
      addBank: () => addBankOnBus(draft.value!, selected),
    } satisfies Record<Exclude<ToolAction, 'undo' | 'redo' | AddOperation>, () => OperationOutcome>;
    run(ops[action]);
  };

  const openChooser = (op: AddOperation, opener: HTMLElement | null) => {
    if (!selected) return;
    refused.value = null;
    // At the project file's element limit nothing is offered: the reason is shown instead.
    if (!run(() => roomForElements(1)).ok) {
      chooser.value = null;
      return;
    }
    chooserOpener.current = opener;
    if (chooser.value?.op === op && chooser.value.target === selected) {
      chooser.value = null;
      return;
    }
    chooser.value = { op, target: selected };
    pendingFocus.current = 'chooser';
  };

  const closeChooser = () => {
    chooser.value = null;
    chooserOpener.current?.focus();
  };

  const onChainKey = (ev: KeyboardEvent) => {
    const target = ev.target as HTMLElement;
    const id = target.closest<HTMLElement>('[data-card-id]')?.dataset['cardId'];
    if (!id) return;
    if (['ArrowLeft', 'ArrowRight', 'ArrowUp', 'ArrowDown', 'Home', 'End'].includes(ev.key)) {
      ev.preventDefault();
      const next = neighbour(layout, id, ev.key);
      if (next) {
        focusId.value = next;
        // The card is already drawn: focus it now, so a second quick key press starts from it (the
        // roving tabindex follows on the next render).
        const card = root.current?.querySelector<HTMLElement>(`[data-card-id="${CSS.escape(next)}"]`);
        if (card) card.focus();
        else pendingFocus.current = next;
      }
    } else if (ev.key === 'Enter' || ev.key === ' ') {
      ev.preventDefault();
      select(id, 'keyboard');
    } else if (ev.key === 'Delete' || ev.key === 'Backspace') {
      ev.preventDefault();
      const r = run(() => removeElement(id));
      if (r.ok) {
        hint.value = { change: lastChange.value, text: ' Undo brings it back (Ctrl+Z).' };
        const next = selectedId.value ?? rootOf(draft.value!)?.id ?? null;
        if (next) {
          focusId.value = next;
          pendingFocus.current = next;
        }
      }
    }
  };

  const renderCard = (id: string) => {
    const e = byId.get(id)!;
    const feeder = layout.parent.get(id);
    return (
      <StageCard
        element={e}
        input={feeder !== undefined ? ports.get(feeder) : undefined}
        result={results.get(id)}
        stale={stale}
        problems={problemCount.get(id) ?? 0}
        selected={id === selected}
        tabIndex={id === active ? 0 : -1}
        units={units}
        locale={locale}
        onSelect={onCardSelect}
        onFocus={onCardFocus}
      />
    );
  };

  /** A card and what follows it: one child continues the row, several are stacked as branches. */
  const renderRun = (id: string): ComponentChildren => {
    const kids = layout.children.get(id) ?? [];
    return (
      <div class="chain-run" key={id}>
        {renderCard(id)}
        {kids.length > 0 && <span class="chain-link" aria-hidden="true" />}
        {kids.length === 1 && renderRun(kids[0]!)}
        {kids.length > 1 && (
          <div class="chain-branches">
            {kids.map((k) => (
              <div class="chain-branch" key={k}>
                {renderRun(k)}
              </div>
            ))}
          </div>
        )}
      </div>
    );
  };

  const hintText = hint.value && hint.value.change === lastChange.value ? hint.value.text : '';
  // A refusal stays shown until something else changes (refuse() also puts it in lastChange).
  const refusal = refused.value !== null && refused.value === lastChange.value ? refused.value : null;
  const statusText = refusal ?? (lastChange.value ? `${lastChange.value}.${hintText}` : '');
  const selectedName = selected ? elementName(p, selected) : '';
  const open = chooser.value && chooser.value.target === selected ? chooser.value : null;
  const offered = open ? offeredTemplates(p, open.op, open.target) : [];
  // The selected card's operations that fit it: the first ones on the toolbar, the rest in "More".
  const tools = { primary: fitting.filter((a) => PRIMARY_ACTIONS.includes(a)), more: fitting.filter((a) => !PRIMARY_ACTIONS.includes(a)) };

  return (
    <section class="editor skip-offscreen" aria-labelledby="editor-heading" data-testid="chain-editor" ref={rootRef}>
      <div class="editor__head">
        <h3 id="editor-heading">Chain</h3>
        <div class="editor__history" role="group" aria-label="History">
          <ToolButton icon="undo" label="Undo" testId="undo" action="undo" onAct={onAct} disabled={!canUndo.value} title={canUndo.value ? `Undo: ${undoLabel.value} (Ctrl+Z)` : 'Nothing to undo'} />
          <ToolButton icon="redo" label="Redo" testId="redo" action="redo" onAct={onAct} disabled={!canRedo.value} title={canRedo.value ? `Redo: ${redoLabel.value} (Ctrl+Shift+Z)` : 'Nothing to redo'} />
        </div>
      </div>
      <p class={refusal ? 'editor__status editor__status--refused' : 'editor__status'} role="status" data-testid="editor-status">
        {statusText}
      </p>
      <p id="chain-help" class="editor__help">
        Tap a stage to edit it. Keys: arrows move along the chain, Enter opens the stage, Delete removes it, Ctrl+Z undoes.
      </p>
      <div class="editor__body">
        <div class="chain-scroll">
          <div class="chain" id="chain-cards" role="group" aria-label="Stages, from the source to the loads" aria-describedby="chain-help" onKeyDown={onChainKey}>
            {layout.order.length > 0 && renderRun(layout.order[0]!)}
          </div>
          {layout.loose.length > 0 && (
            <div class="chain chain--loose" role="group" aria-label="Stages not connected to the source" onKeyDown={onChainKey}>
              <p class="editor__loose-note">Not connected to the source:</p>
              {layout.loose.map((id) => (
                <div class="chain-run" key={id}>
                  {renderCard(id)}
                </div>
              ))}
            </div>
          )}
        </div>
        {selected && (
          <div class="editor__toolbar" role="toolbar" aria-label={`Change the chain at ${selectedName}`} aria-controls="chain-cards" data-testid="card-tools">
            <span class="editor__toolbar-subject" aria-hidden="true">{selectedName}</span>
            {tools.primary.map((a) => (
              <ToolButton key={a} icon={TOOL_WORDS[a].icon} label={TOOL_WORDS[a].label} testId={TOOL_WORDS[a].testId} action={a} onAct={onAct}
                expanded={a === 'after' || a === 'branch' ? open?.op === a : undefined} />
            ))}
            {tools.more.length > 0 && <MoreMenu key={selected} actions={tools.more} onAct={onAct} subject={selectedName} />}
          </div>
        )}
        {open && (
          <div class="kind-chooser" id="kind-chooser" role="group" aria-labelledby="kind-chooser-heading" data-testid="kind-chooser"
            onKeyDown={(ev) => {
              if (ev.key === 'Escape') {
                ev.preventDefault();
                closeChooser();
              }
            }}
          >
            <p class="kind-chooser__heading" id="kind-chooser-heading">
              {ADD_WORDS[open.op].heading(selectedName)}: choose a kind
            </p>
            {offered.length === 0 ? (
              <p class="kind-chooser__none">{NOTHING_OFFERED[open.op]}</p>
            ) : (
              <ul class="kind-chooser__list">
                {offered.map(({ kind, element }) => (
                  <li key={kind}>
                    {kindOption(kind, element, ports.get(open.op === 'before' ? (byId.get(open.target)?.from ?? '') : open.target), () => {
                      const opFn = open.op === 'after' ? insertAfter : open.op === 'branch' ? addBranch : insertBefore;
                      chooser.value = null;
                      run(() => opFn(open.target, element), 'selected');
                    })}
                  </li>
                ))}
              </ul>
            )}
            <button type="button" class="editor-tool kind-chooser__cancel" onClick={closeChooser}>
              Cancel
            </button>
          </div>
        )}
        {selected && (
          <section class="editor__form" aria-label={`Settings of ${selectedName}`} tabIndex={-1} ref={formRef} data-testid="stage-form-area">
            <StageForm elementId={selected} />
          </section>
        )}
      </div>
    </section>
  );

  function kindOption(kind: ElementKind, element: DraftElement, input: FeedingPort | undefined, onChoose: () => void) {
    const summary = keyInputs(element, input, units, locale).join(' · ');
    return (
      <button type="button" class="kind-option" data-kind={kind} onClick={onChoose}>
        <span class="kind-option__name">{elementKindLabel(kind)}</span>
        {summary && <span class="kind-option__detail">{summary}</span>}
      </button>
    );
  }
});

export default ChainEditor;
