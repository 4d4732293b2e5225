/**
 * Sign-in throttling, pure part: how many failed attempts are allowed per account and per address in a window.
 * Counts live in PostgreSQL so every web node sees the same numbers.
 */
export const SIGN_IN_WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_IP = 20;

export interface FailureCounts {
  account: number;
  ip: number;
}

export function isThrottled(counts: FailureCounts): boolean {
  return counts.account >= MAX_FAILURES_PER_ACCOUNT || counts.ip >= MAX_FAILURES_PER_IP;
}

export const THROTTLED_MESSAGE = `Too many failed sign-in attempts. Wait ${SIGN_IN_WINDOW_MINUTES} minutes, or reset your password.`;
