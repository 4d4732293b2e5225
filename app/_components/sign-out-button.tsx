"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/login" })}
      className="rounded-md border border-rule px-3 py-1 text-sm text-ink-soft hover:border-copper hover:text-copper-deep"
    >
      Sign out
    </button>
  );
}
