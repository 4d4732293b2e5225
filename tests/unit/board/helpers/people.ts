import type { Role } from "@/lib/auth/roles";
import type { RuleActor } from "@/board/rules";

/** Fixed people around one proposal: the ids the facts builders put in authorId and the curator/reviewer lists. */
export const IDS = {
  author: "ana",
  familyCurator: "cora",
  otherFamilyCurator: "carl",
  nonFamilyCurator: "nico",
  assignedReviewer: "rita",
  otherReviewer: "rolf",
  stranger: "sam",
} as const;

export const ROLE_COMBOS: readonly (readonly Role[])[] = [
  ["author"],
  ["reviewer"],
  ["curator"],
  ["consumer"],
  ["admin"],
  ["author", "curator"],
  ["reviewer", "curator"],
  ["admin", "curator"],
  [],
];

/**
 * Where the person stands relative to the proposal (independent of the roles they hold). "author-listed" is the
 * author who is also on the family's curator list, so an author+curator there is a family curator of their own work.
 */
export const POSITIONS = ["author", "author-listed", "family-curator", "non-family-curator", "assigned-reviewer", "stranger"] as const;
export type Position = (typeof POSITIONS)[number];

const POSITION_ID: Record<Position, string> = {
  author: IDS.author,
  "author-listed": IDS.author,
  "family-curator": IDS.familyCurator,
  "non-family-curator": IDS.nonFamilyCurator,
  "assigned-reviewer": IDS.assignedReviewer,
  stranger: IDS.stranger,
};

export function actorAt(position: Position, roles: readonly Role[]): RuleActor {
  return { id: POSITION_ID[position], roles };
}

export const rolesLabel = (roles: readonly Role[]) => (roles.length ? roles.join("+") : "no roles");

export const person = (id: string, ...roles: Role[]): RuleActor => ({ id, roles });
