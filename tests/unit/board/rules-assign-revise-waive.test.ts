import { describe, expect, it } from "vitest";
import { decideAssignReviewer, decideRevise, decideWaiveChecks, type MoveDecision, type RuleActor } from "@/board/rules";
import type { Stage } from "@/board/stages";
import type { Role } from "@/lib/auth/roles";
import { openFacts, placeActor } from "./helpers/facts";
import { SPEC_STAGES, specFamilyCurator } from "./helpers/oracle";
import { actorAt, IDS, person, POSITIONS, ROLE_COMBOS, rolesLabel } from "./helpers/people";

/**
 * The specification names the conditions of these three decisions but not their refusal codes; the tests use the
 * move vocabulary: the wrong person is forbidden:move, the wrong stage invalid:transition, a failed condition refused:gate.
 */
type Outcome = "allowed" | "forbidden:move" | "invalid:transition" | "refused:gate";
const outcome = (d: MoveDecision): Outcome => (d.allowed ? "allowed" : d.code);

const REVIEW_STAGES: readonly Stage[] = ["submitted", "under_review", "revision"];
const CANDIDATES: { name: string; reviewer: { id: string; roles: readonly Role[] } }[] = [
  { name: "a reviewer", reviewer: person(IDS.otherReviewer, "reviewer") },
  { name: "a reviewer who is also a curator", reviewer: person(IDS.nonFamilyCurator, "reviewer", "curator") },
  { name: "a consumer", reviewer: person(IDS.stranger, "consumer") },
  { name: "a person with no roles", reviewer: person(IDS.stranger) },
  { name: "the author holding the reviewer role", reviewer: person(IDS.author, "author", "reviewer") },
  { name: "the author", reviewer: person(IDS.author, "author") },
];

describe("decideAssignReviewer for every role combination × position × stage × candidate", () => {
  for (const roles of ROLE_COMBOS) {
    it.each(POSITIONS)(`${rolesLabel(roles)} as %s`, (position) => {
      const actor = actorAt(position, roles);
      for (const stage of SPEC_STAGES) {
        const facts = placeActor(openFacts(stage), position);
        for (const { name, reviewer } of CANDIDATES) {
          // A curator who wrote the proposal may not choose its reviewers (like every other curator action on it).
          const expected: Outcome = !specFamilyCurator(actor, facts) || actor.id === facts.authorId
            ? "forbidden:move"
            : !REVIEW_STAGES.includes(stage)
              ? "invalid:transition"
              : reviewer.id === facts.authorId || !reviewer.roles.includes("reviewer")
                ? "refused:gate"
                : "allowed";
          expect(outcome(decideAssignReviewer(actor, facts, reviewer)), `${stage}, ${name}`).toBe(expected);
        }
      }
    });
  }

  it("admin alone cannot assign, a family curator can", () => {
    const reviewer = person(IDS.otherReviewer, "reviewer");
    expect(outcome(decideAssignReviewer(person(IDS.stranger, "admin"), openFacts("submitted"), reviewer))).toBe("forbidden:move");
    expect(outcome(decideAssignReviewer(person(IDS.familyCurator, "curator"), openFacts("submitted"), reviewer))).toBe("allowed");
  });
});

describe("decideRevise", () => {
  it("only the author, only in draft or revision, whatever roles anyone holds", () => {
    for (const roles of ROLE_COMBOS) {
      for (const position of POSITIONS) {
        const actor = actorAt(position, roles);
        for (const stage of SPEC_STAGES) {
          const facts = placeActor(openFacts(stage), position);
          const expected: Outcome =
            actor.id !== facts.authorId ? "forbidden:move" : stage === "draft" || stage === "revision" ? "allowed" : "invalid:transition";
          expect(outcome(decideRevise(actor, facts)), `${rolesLabel(roles)} as ${position} in ${stage}`).toBe(expected);
        }
      }
    }
  });

  it("an author holding no roles may revise their draft; a family curator may not", () => {
    expect(decideRevise(person(IDS.author), { stage: "draft", authorId: IDS.author })).toEqual({ allowed: true });
    expect(outcome(decideRevise(person(IDS.familyCurator, "curator", "author"), openFacts("revision")))).toBe("forbidden:move");
  });
});

describe("decideWaiveChecks", () => {
  const REASON = "band-edge degeneracy check is too strict here";
  const failing = (stage: Stage = "under_review") => openFacts(stage, { checksRun: true, checksPassing: false });

  it("who: a family curator who is not the author, for every role combination × position", () => {
    for (const roles of ROLE_COMBOS) {
      for (const position of POSITIONS) {
        const actor: RuleActor = actorAt(position, roles);
        const facts = placeActor(failing(), position);
        const may = specFamilyCurator(actor, facts) && actor.id !== facts.authorId;
        const d = decideWaiveChecks(actor, facts, REASON);
        expect(outcome(d), `${rolesLabel(roles)} as ${position}`).toBe(may ? "allowed" : "forbidden:move");
      }
    }
  });

  const curator = person(IDS.familyCurator, "curator");

  it("only when the checks ran and fail", () => {
    expect(decideWaiveChecks(curator, failing(), REASON)).toEqual({ allowed: true });
    expect(outcome(decideWaiveChecks(curator, openFacts("under_review", { checksRun: true, checksPassing: true }), REASON))).toBe("refused:gate");
    expect(outcome(decideWaiveChecks(curator, openFacts("under_review", { checksRun: false, checksPassing: false }), REASON))).toBe("refused:gate");
    expect(outcome(decideWaiveChecks(curator, openFacts("under_review", { checksRun: false, checksPassing: true }), REASON))).toBe("refused:gate");
  });

  it("reason of at least 10 characters: 9 refuses, 10 and more pass, blank refuses", () => {
    expect(outcome(decideWaiveChecks(curator, failing(), "123456789"))).toBe("refused:gate");
    expect(decideWaiveChecks(curator, failing(), "1234567890")).toEqual({ allowed: true });
    expect(decideWaiveChecks(curator, failing(), "12345678901")).toEqual({ allowed: true });
    for (const blank of ["", " ", "            ", "\t\t\t\t\t\t\t\t\t\t\t"]) {
      expect(outcome(decideWaiveChecks(curator, failing(), blank)), JSON.stringify(blank)).toBe("refused:gate");
    }
  });

  it("the author-curator of the proposal is forbidden even with a good reason and failing checks", () => {
    const facts = openFacts("under_review", { checksRun: true, checksPassing: false, familyCuratorIds: [IDS.author] });
    expect(outcome(decideWaiveChecks(person(IDS.author, "author", "curator"), facts, REASON))).toBe("forbidden:move");
  });
});
