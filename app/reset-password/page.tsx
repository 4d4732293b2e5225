import type { Metadata } from "next";
import { AuthFrame } from "@/app/_components/auth-frame";
import { RequestResetForm } from "./request-form";

export const metadata: Metadata = { title: "Reset password" };

export default function ResetPasswordPage() {
  return (
    <AuthFrame title="Reset your password">
      <RequestResetForm />
    </AuthFrame>
  );
}
