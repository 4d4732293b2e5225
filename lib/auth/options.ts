import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { AppError } from "@/lib/errors";
import { authenticate } from "./authenticate";
import { clientIp } from "./client-ip";
import { SIGN_IN_FAILED } from "./sign-in-messages";

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
