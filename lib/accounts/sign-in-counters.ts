import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { signInCounters } from "@/db/schema";
import { SIGN_IN_WINDOW_MINUTES, type AttemptCounts } from "@/lib/auth/rate-limit";

export interface AttemptReservation {
  counts: AttemptCounts;
  /** Which window each slot was taken in, so a give-back never lowers a newer window's count. */
  windows: { account: Date; address: Date };
  email: string;
  address: string;
}

/**
 * Takes one attempt slot for the account and one for the address in a single statement, before any password is
 * checked. The upsert locks each counter row while it adds one, so simultaneous attempts are numbered one after
 * another and at most the limit of them see a number within it. Rows are always locked account first, then address
 * (VALUES order), so two attempts never wait on each other in a cycle. A window opens with its first attempt and
 * lasts SIGN_IN_WINDOW_MINUTES; the next attempt after that starts a new one at 1.
 */
export async function reserveSignInAttempt(email: string, address: string): Promise<AttemptReservation> {
  const expired = sql`${signInCounters.windowStart} <= now() - make_interval(mins => ${SIGN_IN_WINDOW_MINUTES})`;
  // Millisecond precision, so the Date handed back compares equal to the stored value in releaseSignInAttempt.
  const now = sql`date_trunc('milliseconds', now())`;
  const rows = await db
    .insert(signInCounters)
    .values([
      { scope: "account", key: email, attempts: 1, windowStart: now },
      { scope: "address", key: address, attempts: 1, windowStart: now },
    ])
    .onConflictDoUpdate({
      target: [signInCounters.scope, signInCounters.key],
      set: {
        attempts: sql`case when ${expired} then 1 else ${signInCounters.attempts} + 1 end`,
        windowStart: sql`case when ${expired} then ${now} else ${signInCounters.windowStart} end`,
      },
    })
    .returning({ scope: signInCounters.scope, attempts: signInCounters.attempts, windowStart: signInCounters.windowStart });
  const account = rows.find((r) => r.scope === "account")!;
  const byAddress = rows.find((r) => r.scope === "address")!;
  return {
    counts: { account: account.attempts, address: byAddress.attempts },
    windows: { account: account.windowStart, address: byAddress.windowStart },
    email,
    address,
  };
}

/**
 * Hands the slots back: a successful sign-in and a refused (throttled) attempt are not failures. One statement per
 * row, account first, so a give-back never holds one counter while waiting for the other.
 */
export async function releaseSignInAttempt(r: AttemptReservation): Promise<void> {
  for (const [scope, key, windowStart] of [
    ["account", r.email, r.windows.account],
    ["address", r.address, r.windows.address],
  ] as const) {
    await db
      .update(signInCounters)
      .set({ attempts: sql`greatest(${signInCounters.attempts} - 1, 0)` })
      .where(and(eq(signInCounters.scope, scope), eq(signInCounters.key, key), eq(signInCounters.windowStart, windowStart)));
  }
}
