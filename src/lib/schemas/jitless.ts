// zod 4 compiles fast parsers with `new Function` unless told not to, and first tries whether
// it may; the Content-Security-Policy forbids eval (the browser reports every try), so zod is
// told not to. Imported by workbench.ts, which every bundle that parses with zod includes.
import { z } from 'zod';

z.config({ jitless: true });
