import { z } from "zod";

// Runs in the browser before the app's own code. zod compiles object schemas with `new Function`
// when it may; the pages' Content-Security-Policy allows no eval (lib/security-headers.ts), and even
// zod's caught probe for it is reported as a violation, so it is told never to try.
z.config({ jitless: true });
