import type { Metadata } from "next";
import Link from "next/link";
import { AuthFrame } from "@/app/_components/auth-frame";
import { FormMessage } from "@/app/_components/form-parts";
import { describeInvitation } from "@/lib/accounts/service";
import { AppError } from "@/lib/errors";
import { JoinForm } from "./join-form";

export const metadata: Metadata = { title: "Join" };
export const dynamic = "force-dynamic";

export default async function JoinPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let invitation: Awaited<ReturnType<typeof describeInvitation>>;
  try {
    invitation = await describeInvitation(token);
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    return (
      <AuthFrame title="This invitation cannot be used">
        <FormMessage kind="error">{err.message}</FormMessage>
        <Link href="/login" className="text-copper-deep underline">
          Go to sign-in
        </Link>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title={`Welcome, ${invitation.name}`}>
      <p className="mb-4 text-sm text-ink-soft">
        You were invited as <strong>{invitation.roles.join(", ")}</strong> with the address <strong>{invitation.email}</strong>. Choose a
        password to finish joining.
      </p>
      <JoinForm token={token} />
    </AuthFrame>
  );
}
