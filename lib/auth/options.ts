import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { endSessionsOf } from "@/lib/accounts/sessions";
import { AppError } from "@/lib/errors";
import { authenticate } from "./authenticate";
import { clientIp } from "./client-ip";
import { safeReturnPath } from "./return-path";
import { SIGN_IN_FAILED } from "./sign-in-messages";

export const SESSION_MAX_AGE_SECONDS = 8 * 60 * 60;

/** What this app keeps in the (signed, encrypted) session token besides next-auth's own claims. */
export interface SessionClaims {
  uid?: string;
  /** The account's session version at sign-in; a token with an older one is refused. */
  sv?: number;
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/login", error: "/login" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        try {
          const { id, sessionVersion } = await authenticate(credentials, clientIp(req?.headers));
          return { id, sessionVersion };
        } catch (err) {
          // next-auth passes the thrown message to the client as the error code.
          throw new Error(err instanceof AppError ? err.message : SIGN_IN_FAILED);
        }
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.sv = (user as { sessionVersion?: number }).sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      const claims: SessionClaims = {
        uid: typeof token.uid === "string" ? token.uid : undefined,
        sv: typeof token.sv === "number" ? token.sv : undefined,
      };
      return { ...session, ...claims };
    },
    /** Every place next-auth sends a browser to (after sign-in or sign-out) is a path on this site. */
    redirect({ url, baseUrl }) {
      return new URL(safeReturnPath(url, baseUrl), baseUrl).toString();
    },
  },
  events: {
    /** Signing out ends the token itself, not only the browser's copy of it: every session of the account ends. */
    async signOut({ token }) {
      if (typeof token?.uid === "string" && typeof token.sv === "number") await endSessionsOf(token.uid, token.sv);
    },
  },
};
