// Runs in the browser before the app's own modules. zod 4 probes `new Function` the first time it
// builds an object schema, to compile a fast path; under the pages' CSP (no 'unsafe-eval', see
// proxy.ts) that probe is blocked and reported as a violation. Jitless mode skips the probe.
import { z } from 'zod';

z.config({ jitless: true });
