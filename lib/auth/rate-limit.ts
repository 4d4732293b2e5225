/**
 * Sign-in throttling, pure part: how many attempts are allowed per account and per address in a window.
 * Counts live in PostgreSQL so every web node sees the same numbers (lib/accounts/sign-in-counters.ts); a failed
 * attempt keeps its slot, a successful or refused one gives it back.
 */
export const SIGN_IN_WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_IP = 20;

/** Attempts counted in the current windows, this one included. */
export interface AttemptCounts {
  account: number;
  address: number;
}

export function isThrottled(counts: AttemptCounts): boolean {
  return counts.account > MAX_FAILURES_PER_ACCOUNT || counts.address > MAX_FAILURES_PER_IP;
}

export const THROTTLED_MESSAGE = `Too many failed sign-in attempts. Wait ${SIGN_IN_WINDOW_MINUTES} minutes, or reset your password.`;
