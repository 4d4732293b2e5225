import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { PasswordForm } from "./password-form";

export const metadata: Metadata = { title: "Account" };
export const dynamic = "force-dynamic";

export default async function AccountPage() {
  const user = await requirePageUser("/account");
  return (
    <>
      <PageTitle title="Account" />
      <dl className="mb-8 grid max-w-md grid-cols-[6rem_1fr] gap-1 text-sm">
        <dt className="text-ink-soft">Name</dt>
        <dd>{user.name}</dd>
        <dt className="text-ink-soft">E-mail</dt>
        <dd className="num">{user.email}</dd>
        <dt className="text-ink-soft">Roles</dt>
        <dd>{user.roles.join(", ")}</dd>
      </dl>
      <PasswordForm />
    </>
  );
}
