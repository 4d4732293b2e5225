import { physicsHash } from "@/lib/tb/canonical";
import type { ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import type { FitOutcome } from "./record";

/**
 * Whether a fit that started from `base` may be saved on top of `latest` (a revision saved while it ran) without
 * undoing anything: true when, with the fitted values set in both, the two have the same physics — i.e. the later
 * revision changed only parameters this fit replaces (or nothing physical at all).
 */
export function fitStillApplies(base: ModelDocument, latest: ModelDocument, outcome: FitOutcome): boolean {
  const values = Object.fromEntries(outcome.names.map((k, i) => [k, outcome.values[i]]));
  try {
    return physicsHash(setParameters(base, values)) === physicsHash(setParameters(latest, values));
  } catch {
    return false; // a fitted parameter no longer exists in the latest revision
  }
}
