export const ROLES = ["author", "reviewer", "curator", "consumer", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  author: "drafts proposals, uploads reference bands, runs fits, answers remarks, revises",
  reviewer: "reads diffs and band comparisons, writes remarks, gives verdicts",
  curator: "owns model families, assigns reviewers, sets acceptance criteria, releases",
  consumer: "reads the registry and pulls releases with API tokens",
  admin: "invites people and sets roles",
};

export function isRole(value: string): value is Role {
  return (ROLES as readonly string[]).includes(value);
}

export function hasAnyRole(held: readonly Role[], wanted: readonly Role[]): boolean {
  return wanted.some((r) => held.includes(r));
}

/** Roles in a fixed order without duplicates, so stored arrays compare equal. */
export function normaliseRoles(roles: readonly Role[]): Role[] {
  return ROLES.filter((r) => roles.includes(r));
}
