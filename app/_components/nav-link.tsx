"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLink({ href, label }: { href: string; label: string }) {
  const pathname = usePathname();
  const active = href === "/" ? pathname === "/" : pathname === href || pathname.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={active ? "page" : undefined}
      className={`rounded-md px-3 py-1.5 text-[0.95rem] ${
        active ? "bg-paper-deep font-semibold text-ink" : "text-ink-soft hover:bg-paper-deep hover:text-ink"
      }`}
    >
      {label}
    </Link>
  );
}
