// Vitest setup (vite.config.ts, projects `unit` and `properties`): the page loads the engine on demand
// (web/state/engine.ts, started by web/main.tsx); the Node tests of the page's state have it loaded
// before they start, as the page has it before a project can be edited.
import { loadEngine } from '../../web/state/engine.ts';

await loadEngine();
