import type { MoveDecision } from "@/board/rules";
import type { Expected } from "./oracle";

/** Why a decision disagrees with the expectation, or null when it agrees. */
export function mismatch(actual: MoveDecision, expected: Expected): string | null {
  const got = actual.allowed ? "allowed" : `${actual.code} [${actual.reasons.length} reason(s)]`;
  if (expected.kind === "allowed") return actual.allowed ? null : `expected allowed, got ${got}`;
  if (actual.allowed) return `expected ${expected.kind}, got allowed`;
  if (actual.reasons.some((r) => r.trim() === "")) return `blank reason in ${JSON.stringify(actual.reasons)}`;
  if (expected.kind === "release-only") {
    const ok = (actual.code === "invalid:transition" || actual.code === "refused:gate") && actual.reasons.length === 1;
    return ok ? null : `expected a refusal with one reason (invalid:transition or refused:gate), got ${got}`;
  }
  if (actual.code !== expected.kind) return `expected ${expected.kind}, got ${got}`;
  if (expected.kind === "refused:gate" && actual.reasons.length !== expected.failing.length) {
    return `expected ${expected.failing.length} reasons (${expected.failing.join(", ")}), got ${JSON.stringify(actual.reasons)}`;
  }
  if (actual.reasons.length === 0) return `expected at least one reason, got none`;
  return null;
}
