import "server-only";
import bcrypt from "bcryptjs";
import { countRecentFailures, getCredentialsByEmail, recordSignInAttempt } from "@/lib/accounts/queries";
import { signInInput } from "@/lib/accounts/schemas";
import { AppError } from "@/lib/errors";
import { isThrottled } from "./rate-limit";
import { SIGN_IN_FAILED, SIGN_IN_THROTTLED } from "./sign-in-messages";
import { verifyPassword } from "./secrets";

let dummyHash: string | undefined;
/** Compared against for unknown e-mails, so they cost as much time as a wrong password. */
function dummyPasswordHash(): string {
  return (dummyHash ??= bcrypt.hashSync("no-such-account", 11));
}


/**
 * Check e-mail and password with per-account and per-address throttling.
 * Returns the user id, or throws an AppError whose code the sign-in page turns into a message.
 */
export async function authenticate(raw: unknown, ip: string): Promise<string> {
  const parsed = signInInput.safeParse(raw);
  if (!parsed.success) throw new AppError("invalid:credentials", SIGN_IN_FAILED);
  const { email, password } = parsed.data;
  if (isThrottled(await countRecentFailures(email, ip))) {
    throw new AppError("rate-limited:sign-in", SIGN_IN_THROTTLED);
  }
  const row = await getCredentialsByEmail(email);
  const ok = await verifyPassword(password, row?.passwordHash ?? dummyPasswordHash());
  const allowed = Boolean(row && row.passwordHash && row.active && ok);
  await recordSignInAttempt(email, ip, allowed);
  if (!allowed) throw new AppError("invalid:credentials", SIGN_IN_FAILED);
  return row!.id;
}
