import { THROTTLED_MESSAGE } from "./rate-limit";

export const SIGN_IN_FAILED = "signin-failed";
export const SIGN_IN_THROTTLED = "signin-throttled";

export function signInErrorMessage(code: string | null | undefined): string | null {
  if (!code) return null;
  if (code === SIGN_IN_THROTTLED) return THROTTLED_MESSAGE;
  if (code === SIGN_IN_FAILED || code === "CredentialsSignin") return "That e-mail and password do not match an active account.";
  return "Sign-in failed. Try again.";
}
