import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { AppError } from "@/lib/errors";
import { authenticate } from "./authenticate";
import { SIGN_IN_FAILED } from "./sign-in-messages";

function clientIp(headers: unknown): string {
  const get = (name: string): string | undefined => {
    if (headers && typeof (headers as Headers).get === "function") return (headers as Headers).get(name) ?? undefined;
    const value = (headers as Record<string, string | string[] | undefined> | undefined)?.[name];
    return Array.isArray(value) ? value[0] : value;
  };
  return get("x-forwarded-for")?.split(",")[0]?.trim() || get("x-real-ip") || "unknown";
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
  pages: { signIn: "/login", error: "/login" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        try {
          const id = await authenticate(credentials, clientIp(req?.headers));
          return { id };
        } catch (err) {
          // next-auth passes the thrown message to the client as the error code.
          throw new Error(err instanceof AppError ? err.message : SIGN_IN_FAILED);
        }
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) token.uid = user.id;
      return token;
    },
    session({ session, token }) {
      return { ...session, uid: typeof token.uid === "string" ? token.uid : undefined };
    },
  },
};
