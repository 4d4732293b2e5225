"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, FormMessage, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { signInErrorMessage } from "@/lib/auth/sign-in-messages";

/** `returnTo` is already a same-site path (the page checks it with safeReturnPath). */
export function SignInForm({ returnTo, initialError }: { returnTo: string; initialError: string | null }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(signInErrorMessage(initialError));
  const [pending, setPending] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    const result = await signIn("credentials", {
      redirect: false,
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
    });
    if (!result || result.error) {
      setPending(false);
      setError(signInErrorMessage(result?.error ?? "signin-failed"));
      return;
    }
    router.replace(returnTo);
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate>
      {error ? <FormMessage kind="error">{error}</FormMessage> : null}
      <Field label="E-mail" name="email">
        <input id="email" name="email" type="email" autoComplete="username" required className={inputClass} />
      </Field>
      <Field label="Password" name="password">
        <input id="password" name="password" type="password" autoComplete="current-password" required className={inputClass} />
      </Field>
      <div className="flex items-center justify-between">
        <button type="submit" disabled={pending} className={primaryButtonClass}>
          {pending ? "Signing in…" : "Sign in"}
        </button>
        <Link href="/reset-password" className="text-sm text-copper-deep underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
