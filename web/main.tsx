import './no-eval.ts';
import { render } from 'preact';
import { App } from './components/App.tsx';
import './styles.css';
import './print.css';
import { startStorage } from './storage/session.ts';
import { registerServiceWorker } from './sw-register.ts';

const root = document.getElementById('app');
if (!root) throw new Error('The page has no #app element.');
render(<App />, root);
startStorage();
void registerServiceWorker();
