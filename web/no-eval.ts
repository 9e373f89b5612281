/**
 * Imported first by main.tsx: the page's content security policy forbids eval, so zod must not try
 * its compiled fast path (it would call `new Function`, which the policy refuses and reports).
 */
import { z } from 'zod';

z.config({ jitless: true });
