import type { Role } from "./roles";

export interface NavItem {
  href: string;
  label: string;
  /** Shown to anyone signed in when empty; otherwise to holders of any of these roles. */
  roles: readonly Role[];
}

/** The roles that take part in review and may see proposals. */
export const BOARD_ROLES = ["author", "reviewer", "curator", "admin"] as const;

export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/", label: "Overview", roles: [] },
  { href: "/board", label: "Review board", roles: BOARD_ROLES },
  { href: "/families", label: "Model families", roles: [] },
  { href: "/registry", label: "Registry", roles: [] },
  { href: "/admin/people", label: "People", roles: ["admin"] },
  { href: "/admin/mailbox", label: "Mail catcher", roles: ["admin"] },
  { href: "/admin/audit", label: "Audit trail", roles: ["admin", "curator"] },
  { href: "/settings/tokens", label: "API tokens", roles: [] },
  { href: "/account", label: "Account", roles: [] },
];

export function navigationFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.length === 0 || item.roles.some((r) => roles.includes(r)));
}
