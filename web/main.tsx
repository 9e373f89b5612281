import './no-eval.ts';
import { render } from 'preact';
import { App } from './components/App.tsx';
import './styles.css';
import './print.css';
import { startStorage } from './storage/session.ts';
import { loadEngine } from './state/engine.ts';
import { registerServiceWorker } from './sw-register.ts';
import { framedByAnotherOrigin, showFramedNotice } from './frame-guard.ts';

const root = document.getElementById('app');
if (!root) throw new Error('The page has no #app element.');
if (framedByAnotherOrigin(window as unknown as Parameters<typeof framedByAnotherOrigin>[0])) {
  // Inside another origin's frame: no app, no storage, no service worker (web/frame-guard.ts).
  showFramedNotice(root, window.location.href);
} else {
  // The engine (validation, solve, conductor sizing) loads beside the first paint and the storage read;
  // a failure is shown in place of the results (web/state/engine.ts `engineFailure`).
  loadEngine().catch(() => {});
  render(<App />, root);
  startStorage();
  void registerServiceWorker();
}
