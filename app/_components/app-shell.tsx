import Link from "next/link";
import { navigationFor } from "@/lib/auth/navigation";
import type { SessionUser } from "@/lib/auth/session-user";
import { BrandMark } from "./brand-mark";
import { NavLink } from "./nav-link";
import { SignOutButton } from "./sign-out-button";

export function AppShell({ user, children }: { user: SessionUser; children: React.ReactNode }) {
  const items = navigationFor(user.roles);
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-rule bg-card/80">
        <div className="mx-auto flex max-w-[100rem] items-center gap-6 px-5 py-3">
          <Link href="/" className="flex items-center gap-2.5" aria-label="Bandgate overview">
            <BrandMark size={30} />
            <span className="text-lg font-semibold tracking-tight">Bandgate</span>
          </Link>
          <nav aria-label="Main" className="flex flex-1 flex-wrap items-center gap-1">
            {items.map((item) => (
              <NavLink key={item.href} href={item.href} label={item.label} />
            ))}
          </nav>
          <div className="flex items-center gap-3">
            <div className="text-right leading-tight">
              <div className="text-sm font-semibold" data-testid="signed-in-name">
                {user.name}
              </div>
              <div className="text-xs text-ink-soft" data-testid="signed-in-roles">
                {user.roles.join(" · ") || "no roles"}
              </div>
            </div>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-[100rem] flex-1 px-5 py-8">{children}</main>
      <footer className="border-t border-rule py-4 text-center text-xs text-ink-soft">
        Bandgate · review and release of tight-binding models
      </footer>
    </div>
  );
}
