"use client";

import { z } from "zod";

// zod probes `Function("")` once to choose a faster object parser; under the content security policy (no
// 'unsafe-eval') that probe is a reported violation, so the browser uses the plain parser from the start.
z.config({ jitless: true });

/** Rendered once in the root layout, so the setting is made before any client code parses anything. */
export function NoEval() {
  return null;
}
