import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { AuthFrame } from "@/app/_components/auth-frame";
import { currentUser } from "@/lib/auth/guard";
import { safeCallbackPath } from "@/lib/auth/sign-in-messages";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

export default async function LoginPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string }> }) {
  const params = await searchParams;
  if (await currentUser()) redirect(safeCallbackPath(params.callbackUrl));
  return (
    <AuthFrame title="Sign in">
      <SignInForm callbackUrl={params.callbackUrl ?? null} initialError={params.error ?? null} />
      <p className="mt-6 text-xs text-ink-soft">New here? Accounts are created by invitation from your group&apos;s admin.</p>
    </AuthFrame>
  );
}
