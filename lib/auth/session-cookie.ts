import "server-only";
import { decode, encode } from "next-auth/jwt";
import { cookies } from "next/headers";
import { SESSION_MAX_AGE_SECONDS } from "./options";

/** next-auth's session cookie; the __Secure- one is used when the site is served over https. */
const SESSION_COOKIES = ["__Secure-next-auth.session-token", "next-auth.session-token"] as const;

/**
 * After a change that ended all of a person's sessions (their own password or roles), keeps the session they made it
 * from: re-issues this browser's token with the new session version, as next-auth itself re-issues it on use.
 */
export async function renewOwnSession(sessionVersion: number): Promise<void> {
  const secret = process.env.NEXTAUTH_SECRET;
  const jar = await cookies();
  const name = SESSION_COOKIES.find((n) => jar.has(n));
  if (!secret || !name) return;
  const token = await decode({ token: jar.get(name)?.value, secret });
  if (!token) return;
  const value = await encode({ token: { ...token, sv: sessionVersion }, secret, maxAge: SESSION_MAX_AGE_SECONDS });
  jar.set(name, value, {
    httpOnly: true,
    sameSite: "lax",
    path: "/",
    secure: name.startsWith("__Secure-"),
    maxAge: SESSION_MAX_AGE_SECONDS,
  });
}
