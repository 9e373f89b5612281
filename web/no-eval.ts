/**
 * Imported first by main.tsx: the page's content security policy forbids eval, so zod must not try
 * its compiled fast path (it would call `new Function`, which the policy refuses and reports).
 */
// zod/mini shares the global config with the full zod (one core), without pulling the full API in.
import { z } from 'zod/mini';

z.config({ jitless: true });
