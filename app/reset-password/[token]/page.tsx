import type { Metadata } from "next";
import { AuthFrame } from "@/app/_components/auth-frame";
import { ResetForm } from "./reset-form";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetWithTokenPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <AuthFrame title="Choose a new password">
      <ResetForm token={token} />
    </AuthFrame>
  );
}
