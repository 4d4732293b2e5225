import "server-only";
import bcrypt from "bcryptjs";
import { getCredentialsByEmail, recordSignInAttempt } from "@/lib/accounts/queries";
import { signInInput } from "@/lib/accounts/schemas";
import { releaseSignInAttempt, reserveSignInAttempt } from "@/lib/accounts/sign-in-counters";
import { AppError } from "@/lib/errors";
import { isThrottled } from "./rate-limit";
import { SIGN_IN_FAILED, SIGN_IN_THROTTLED } from "./sign-in-messages";
import { verifyPassword } from "./secrets";

let dummyHash: string | undefined;
/** Compared against for unknown e-mails, so they cost as much time as a wrong password. */
function dummyPasswordHash(): string {
  return (dummyHash ??= bcrypt.hashSync("no-such-account", 11));
}

export interface Authenticated {
  id: string;
  /** Goes into the session token; the guard refuses the token once the account's version moves on. */
  sessionVersion: number;
}

/**
 * Check e-mail and password with per-account and per-address throttling. The attempt takes its slot in the counters
 * before bcrypt runs, so simultaneous attempts cannot all pass the check. `ip` is the client address from clientIp.
 * Returns the user, or throws an AppError whose code the sign-in page turns into a message.
 */
export async function authenticate(raw: unknown, ip: string): Promise<Authenticated> {
  const parsed = signInInput.safeParse(raw);
  if (!parsed.success) throw new AppError("invalid:credentials", SIGN_IN_FAILED);
  const { email, password } = parsed.data;
  const reservation = await reserveSignInAttempt(email, ip);
  if (isThrottled(reservation.counts)) {
    await releaseSignInAttempt(reservation);
    throw new AppError("rate-limited:sign-in", SIGN_IN_THROTTLED);
  }
  const row = await getCredentialsByEmail(email);
  const ok = await verifyPassword(password, row?.passwordHash ?? dummyPasswordHash());
  const allowed = Boolean(row && row.passwordHash && row.active && ok);
  await recordSignInAttempt(email, ip, allowed);
  if (!allowed) throw new AppError("invalid:credentials", SIGN_IN_FAILED);
  await releaseSignInAttempt(reservation);
  return { id: row!.id, sessionVersion: row!.sessionVersion };
}
