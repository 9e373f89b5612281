/**
 * The study panels under the results (battery backup, conductor sizing, machines and cost, starting and
 * fault current) and the disclosure each sits in. A panel opens (and scrolls into view) when the user
 * opens it, or when another part of the page asks for its working through `web/state/working.ts`.
 */
import { lazy, Suspense } from 'preact/compat';
import { useEffect, useRef, useState } from 'preact/hooks';
import type { Solved } from '../../core/page.ts';
import { studiesOf } from '../state/engine.ts';
import { useOffscreenLag } from './lag.ts';
import { workingRequest } from '../state/working.ts';
import { hasBankOnBus } from './modes/mode-state.ts';

/** The battery, conductor and machines panels: each module loads the first time its panel is opened. */
const BatteryPanel = lazy(() => import('./BatteryPanel.tsx'));
const ConductorPanel = lazy(() => import('./ConductorPanel.tsx'));
const MachinesPanel = lazy(() => import('./MachinesPanel.tsx'));
const StartingPanel = lazy(() => import('./StartingPanel.tsx'));
/** A bank on a bus (issue 19): the charger sizing, the cost of standing by and the transfer. */
const StandbyPanel = lazy(() => import('./modes/StandbyPanel.tsx'));
/** The runtime with its spread (issue 20 point 3): its own worker starts when it runs. */
const SpreadPanel = lazy(() => import('./spread/SpreadPanel.tsx'));
/** The project's variants side by side (issue 20 point 1). */
const VariantsPanel = lazy(() => import('./variants/VariantsPanel.tsx'));
/** Find the option (issue 20 point 4): the search over the user's candidates, in a worker of its own. */
const SearchPanel = lazy(() => import('./search/SearchPanel.tsx'));
/**
 * Brings the asked-for figure (its `data-testid`) or the element's row (`data-element-id`) of an opened
 * panel into view, marks it and gives it the focus. The panel loads lazily and its study may come from
 * the worker, so the target is looked for on each frame for a few seconds. Returns the cancel.
 */
function pointAt(box: HTMLElement, figure: string | undefined, elementId: string | undefined): () => void {
  const selector = figure !== undefined ? `[data-testid="${CSS.escape(figure)}"]` : `[data-element-id="${CSS.escape(elementId!)}"]`;
  const until = performance.now() + 5000;
  let frame = 0;
  const look = () => {
    const target = box.querySelector<HTMLElement>(selector);
    if (!target) {
      if (performance.now() < until) frame = requestAnimationFrame(look);
      return;
    }
    // A tall target (a cable's whole working) from its top; a figure in the middle of the screen.
    target.scrollIntoView({ block: target.getBoundingClientRect().height > window.innerHeight * 0.6 ? 'start' : 'center' });
    if (!target.hasAttribute('tabindex') && !target.matches('button, a, input, select, textarea')) target.tabIndex = -1;
    target.focus({ preventScroll: true });
    target.classList.add('working-target');
    target.addEventListener('blur', () => target.classList.remove('working-target'), { once: true });
  };
  frame = requestAnimationFrame(look);
  return () => cancelAnimationFrame(frame);
}

/**
 * A disclosure whose content (a lazily loaded panel) is rendered only while it is open. It opens,
 * scrolls into view and takes the focus when a figure elsewhere asks for its working (`showWorking`).
 */
export function PanelDisclosure({ id, title, hint, children }: { id: string; title: string; hint: string; children: () => preact.ComponentChildren }) {
  const [open, setOpen] = useState(false);
  const ref = useRef<HTMLDetailsElement>(null);
  const request = workingRequest.value;
  useEffect(() => {
    const box = ref.current;
    if (!request || request.panel !== id || !box) return;
    box.open = true;
    setOpen(true);
    box.scrollIntoView({ block: 'start' });
    box.querySelector<HTMLElement>('summary')?.focus({ preventScroll: true });
    if (request.elementId === undefined && request.figure === undefined) return;
    return pointAt(box, request.figure, request.elementId);
  }, [request, id]);
  return (
    <details ref={ref} class="panel" data-testid={`panel-${id}`} onToggle={(e) => setOpen((e.currentTarget as HTMLDetailsElement).open)}>
      <summary class="panel__summary">
        <span class="panel__title">{title}</span>
        <span class="panel__hint">{hint}</span>
      </summary>
      {open && <Suspense fallback={<p class="note">Opening…</p>}>{children()}</Suspense>}
    </details>
  );
}

/**
 * The panels that apply to the open project (a battery source with a bank; sized conductors; always
 * the machines and cost panel), read from the last valid solved pair the panels study.
 */
export function PanelShelf({ solved: latest }: { solved: Solved }) {
  // An open panel scrolled out of view follows the edits when the page is idle (lag.ts).
  const { box, shown: solved } = useOffscreenLag(latest);
  const { project, result } = solved;
  // Which studies apply: the kinds' `studies` traits (core/kinds). The backup study needs the bank itself.
  const studies = studiesOf(project.elements);
  const battery = studies.has('backup') && project.elements.some((e) => e.kind === 'battery' && e.bank !== undefined);
  const conductors = result.elements.some((e) => e.conductor);
  const machines = studies.has('machines');
  return (
    <section class="panels skip-offscreen" aria-label="Studies of this project" data-testid="panels" ref={box}>
      {battery && (
        <PanelDisclosure id="battery" title="Battery backup" hint="runtime, why not Wh ÷ W, bank sizing, recharge, plot">
          {() => <BatteryPanel />}
        </PanelDisclosure>
      )}
      {battery && project.backup && (
        <PanelDisclosure id="spread" title="Runtime spread" hint="runtime, bank and cost as P10/P50/P90 over the tolerances, which input matters most">
          {() => <SpreadPanel />}
        </PanelDisclosure>
      )}
      {hasBankOnBus(project) && (
        <PanelDisclosure id="standby" title="Standing by and transfer" hint="charger sizing with N+1, what standing by costs a year, the moment the supply is cut">
          {() => <StandbyPanel />}
        </PanelDisclosure>
      )}
      {conductors && (
        <PanelDisclosure id="conductor" title="Conductor sizing" hint="size and why, ampacity, device, drop, heat, working">
          {() => <ConductorPanel solved={solved} />}
        </PanelDisclosure>
      )}
      <PanelDisclosure
        id="machines"
        title={machines ? 'Machines, power factor and running cost' : 'Power factor and running cost'}
        hint={machines ? 'motors, drives, pumps, pump duty study, capacitor bank, cost of losses' : 'capacitor bank, cost of losses per year'}
      >
        {() => <MachinesPanel />}
      </PanelDisclosure>
      {project.elements.some((e) => (e.kind === 'battery' && e.bank !== undefined) || (e.kind === 'cable' && e.conductor !== undefined) || e.kind === 'inverter') && (
        <PanelDisclosure id="search" title="Find the option" hint="strings, conductor sizes and inverters to try: the cheapest options that meet a target">
          {() => <SearchPanel solved={solved} />}
        </PanelDisclosure>
      )}
      <PanelDisclosure
        id="starting"
        title="Motor starting and fault current"
        hint="will it start, fault current at each point, device interrupting ratings, traps"
      >
        {() => <StartingPanel solved={solved} />}
      </PanelDisclosure>
      <PanelDisclosure id="variants" title="Compare options" hint="12, 24 or 48 V, critical loads only, the next size up, any field: side by side">
        {() => <VariantsPanel />}
      </PanelDisclosure>
    </section>
  );
}

