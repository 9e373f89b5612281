/**
 * Off-screen parts catch up after the paint.
 *
 * After an edit, the parts of the page that show results re-render in the edit's own frame only
 * when they are on screen. A part that is off screen keeps what it showed until the frame with the
 * new figures has been painted, then catches up when the page is next idle: a frame or two later
 * (about 50 ms after the edit on the test machine; the idle-callback timeout bounds the wait at
 * 100 ms on a busy page). So the figures and the diagram a person is looking at are painted first,
 * and the tables, cards and panels scrolled away from do not add their rendering to that frame.
 * Their text, in the DOM and the accessibility tree, is never more than that behind.
 *
 * Whether a part is on screen comes from one IntersectionObserver (no margin). Until the observer
 * has reported on a part it counts as on screen, so a part shows the latest value when it first
 * appears. Opening another project is not an edit: every part shows it at once, so the page never
 * mixes two projects. Before printing, every part catches up at once.
 */
import { h, type FunctionComponent } from 'preact';
import { memo } from 'preact/compat';
import { useCallback, useEffect, useRef, useState } from 'preact/hooks';
import { openCount } from '../state/editor.ts';

interface Watched {
  onScreen: boolean;
}

const watched = new WeakMap<Element, Watched>();
let observer: IntersectionObserver | undefined;

function observe(el: Element, state: Watched): void {
  if (typeof IntersectionObserver === 'undefined') return;
  observer ??= new IntersectionObserver((entries) => {
    for (const entry of entries) {
      const s = watched.get(entry.target);
      if (s) s.onScreen = entry.isIntersecting;
    }
  });
  watched.set(el, state);
  observer.observe(el);
}

function unobserve(el: Element): void {
  watched.delete(el);
  observer?.unobserve(el);
}

/** Catch-up work waiting for the page to be idle, run at once before printing. */
const waiting = new Set<() => void>();
let printHooked = false;

/** Runs every catch-up now (before printing; the print button). */
export function catchUpNow(): void {
  for (const run of [...waiting]) run();
}

function hookPrint(): void {
  if (printHooked || typeof window === 'undefined') return;
  printHooked = true;
  window.addEventListener('beforeprint', catchUpNow);
  window.matchMedia?.('print').addEventListener?.('change', (e) => e.matches && catchUpNow());
}

/**
 * Runs `run` when the page is next idle (after the frame being rendered has been painted, as
 * this is called from an effect), or before printing, whichever comes first. Returns a cancel.
 */
export function whenIdle(run: () => void): () => void {
  hookPrint();
  let handle: number | undefined;
  const once = () => {
    if (!waiting.delete(once)) return;
    if (handle !== undefined) (typeof cancelIdleCallback === 'function' ? cancelIdleCallback : clearTimeout)(handle);
    run();
  };
  waiting.add(once);
  handle =
    typeof requestIdleCallback === 'function'
      ? requestIdleCallback(once, { timeout: 100 })
      : (setTimeout(once, 0) as unknown as number);
  return () => {
    if (!waiting.delete(once)) return;
    if (handle !== undefined) (typeof cancelIdleCallback === 'function' ? cancelIdleCallback : clearTimeout)(handle);
  };
}

/**
 * One idle task per component: `schedule(run)` queues it unless one is already waiting, which then
 * runs the `run` given last. Cancelled when the component goes.
 */
export function useIdleTask(): (run: () => void) => void {
  const pending = useRef<(() => void) | null>(null);
  const latest = useRef<() => void>(() => {});
  useEffect(() => () => pending.current?.(), []);
  return useCallback((run: () => void) => {
    latest.current = run;
    pending.current ??= whenIdle(() => {
      pending.current = null;
      latest.current();
    });
  }, []);
}

/** The ref a lagging part puts on its outermost element. */
export type BoxRef = (el: Element | null) => void;

/**
 * `value` as this part should show it now: the latest while the part is on screen, the one shown
 * before while it is off screen (the latest follows when the page is idle). `box` is a ref for the
 * part's outermost element (stable between renders).
 */
export function useOffscreenLag<T>(value: T): { box: BoxRef; shown: T } {
  const state = useRef<Watched>({ onScreen: true });
  const element = useRef<Element | null>(null);
  const shown = useRef(value);
  const [, setTick] = useState(0);
  const opened = openCount.value;
  const openedShown = useRef(opened);
  if (state.current.onScreen || opened !== openedShown.current) {
    shown.current = value;
    openedShown.current = opened;
  }
  const latest = useRef(value);
  latest.current = value;

  const box = useCallback((el: Element | null) => {
    if (element.current === el) return;
    if (element.current) unobserve(element.current);
    element.current = el;
    // A new element (or none) counts as on screen until the observer says otherwise.
    state.current = { onScreen: true };
    if (el) observe(el, state.current);
  }, []);

  // One catch-up at a time: it takes the latest value when it runs, so quick edits in a row do not
  // push it back.
  const schedule = useIdleTask();
  useEffect(() => {
    if (shown.current === latest.current) return;
    schedule(() => {
      if (shown.current === latest.current) return;
      shown.current = latest.current;
      setTick((t) => t + 1);
    });
  });
  useEffect(
    () => () => {
      if (element.current) unobserve(element.current);
    },
    [],
  );

  return { box, shown: shown.current };
}

/**
 * A results part that lags while off screen: `Part` renders from the value it is given (memo'd, so
 * a lagging part is not even compared again) and puts `box` on its outermost element.
 */
export function lagOffscreen<P extends { result: unknown; box: BoxRef }>(Part: FunctionComponent<P>): FunctionComponent<Omit<P, 'box'>> {
  const Inner = memo(Part);
  function Lagging(props: Omit<P, 'box'>) {
    const { box, shown } = useOffscreenLag(props.result);
    return h(Inner, { ...props, result: shown, box } as unknown as P);
  }
  Lagging.displayName = `Lagging(${Part.displayName ?? Part.name})`;
  return Lagging;
}
