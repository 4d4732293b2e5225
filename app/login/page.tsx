import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { AuthFrame } from "@/app/_components/auth-frame";
import { currentUser } from "@/lib/auth/guard";
import { safeReturnPath } from "@/lib/auth/return-path";
import { serverEnv } from "@/lib/env";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

type LoginParams = { callbackUrl?: string | string[]; error?: string | string[] };

export default async function LoginPage({ searchParams }: { searchParams: Promise<LoginParams> }) {
  const params = await searchParams;
  // Decided here, once: the form only ever gets a path on this site (a malformed or foreign one becomes "/").
  const returnTo = safeReturnPath(params.callbackUrl, serverEnv().APP_URL);
  if (await currentUser()) redirect(returnTo);
  return (
    <AuthFrame title="Sign in">
      <SignInForm returnTo={returnTo} initialError={typeof params.error === "string" ? params.error : null} />
      <p className="mt-6 text-xs text-ink-soft">New here? Accounts are created by invitation from your group&apos;s admin.</p>
    </AuthFrame>
  );
}
