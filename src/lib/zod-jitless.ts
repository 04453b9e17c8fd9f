// Imported first by every client entry (main.tsx, the design worker). zod 4 otherwise probes
// `new Function` to speed up object parsing; the app's Content-Security-Policy has no
// 'unsafe-eval', so the probe fails (harmlessly) but is reported as a CSP violation. Object
// schemas read this setting when they are built, hence before any schema module loads.
import { z } from 'zod';

z.config({ jitless: true });
