import { z } from "zod";

/**
 * zod 4 probes for `new Function` (to compile faster object parsers) the first time it parses an object. The pages'
 * Content-Security-Policy forbids eval, so in the browser that probe is blocked and reported as a CSP violation; this
 * tells zod not to try. Imported once by the client providers, before any form parses.
 */
z.config({ jitless: true });
