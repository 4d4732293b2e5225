import { describe, expect, it } from "vitest";
import { decideMove, type MoveOptions, type ProposalFacts } from "@/board/rules";
import { STAGES, type Stage } from "@/board/stages";
import { ROLES } from "@/lib/auth/roles";
import { mismatch } from "./helpers/compare";
import { closedFacts, openFacts, placeActor } from "./helpers/facts";
import { expectedMove, SPEC_STAGES, specRow, type Expected } from "./helpers/oracle";
import { actorAt, IDS, person, POSITIONS, ROLE_COMBOS, rolesLabel } from "./helpers/people";

const PAIRS: [Stage, Stage][] = SPEC_STAGES.flatMap((from) => SPEC_STAGES.map((to): [Stage, Stage] => [from, to]));

const SCENARIOS: { name: string; facts: (stage: Stage) => ProposalFacts; opts: MoveOptions }[] = [
  { name: "every gate open, reason given, via the release form", facts: (s) => openFacts(s), opts: { reason: "out of scope for this family", viaRelease: true } },
  { name: "every gate failing, no reason, not via the release form", facts: (s) => closedFacts(s), opts: {} },
  { name: "every gate failing, blank reason", facts: (s) => closedFacts(s, { checksRun: true }), opts: { reason: "  \t ", viaRelease: false } },
];

describe("the stage and role lists the matrix is built on", () => {
  it("match the specification's eight stages and five roles", () => {
    expect([...STAGES].sort()).toEqual([...SPEC_STAGES].sort());
    expect([...ROLES].sort()).toEqual(["admin", "author", "consumer", "curator", "reviewer"]);
    expect(PAIRS).toHaveLength(64);
  });
});

describe.each(SCENARIOS)("every role combination × position × 64 stage pairs: $name", ({ facts, opts }) => {
  for (const roles of ROLE_COMBOS) {
    it.each(POSITIONS)(`${rolesLabel(roles)} as %s`, (position) => {
      const actor = actorAt(position, roles);
      const wrong: string[] = [];
      for (const [from, to] of PAIRS) {
        const f = placeActor(facts(from), position);
        const why = mismatch(decideMove(actor, f, to, opts), expectedMove(actor, f, to, opts));
        if (why) wrong.push(`${from} → ${to}: ${why}`);
      }
      expect(wrong).toEqual([]);
    });
  }
});

describe("the matrix is not vacuous", () => {
  it("the oracle yields every outcome somewhere across the scenarios", () => {
    const seen = new Set<Expected["kind"]>();
    for (const { facts, opts } of SCENARIOS)
      for (const roles of ROLE_COMBOS)
        for (const position of POSITIONS)
          for (const [from, to] of PAIRS) {
            const f = placeActor(facts(from), position);
            seen.add(expectedMove(actorAt(position, roles), f, to, opts).kind);
          }
    expect([...seen].sort()).toEqual(["allowed", "forbidden:move", "invalid:transition", "refused:gate", "release-only"]);
  });

  it("the table has 14 moves, none out of released, declined or withdrawn, none to the same stage", () => {
    const moves = PAIRS.filter(([from, to]) => specRow(from, to));
    expect(moves).toHaveLength(14);
    for (const [from, to] of moves) {
      expect(["released", "declined", "withdrawn"]).not.toContain(from);
      expect(from).not.toBe(to);
    }
  });
});

describe("anchor cases read straight off the table", () => {
  const curator = person(IDS.familyCurator, "curator");
  const author = person(IDS.author, "author");

  it("a family curator accepts a proposal whose gates all hold", () => {
    expect(decideMove(curator, openFacts("under_review"), "accepted")).toEqual({ allowed: true });
  });

  it("the author submits a clean draft and withdraws from every open stage", () => {
    expect(decideMove(author, openFacts("draft"), "submitted")).toEqual({ allowed: true });
    for (const stage of ["draft", "submitted", "under_review", "revision"] as const) {
      expect(decideMove(author, openFacts(stage), "withdrawn")).toEqual({ allowed: true });
    }
  });

  it("author moves depend on being the author, not on the author role", () => {
    expect(decideMove(person(IDS.author), openFacts("draft"), "submitted")).toEqual({ allowed: true });
    expect(decideMove(person(IDS.stranger, "author"), openFacts("draft"), "submitted")).toMatchObject({ allowed: false, code: "forbidden:move" });
  });

  it("admin holds no special power over moves", () => {
    const admin = person(IDS.stranger, "admin", "reviewer", "consumer", "author");
    for (const [from, to] of PAIRS) {
      const d = decideMove(admin, openFacts(from), to, { reason: "a reason", viaRelease: true });
      expect(d.allowed, `${from} → ${to}`).toBe(false);
    }
  });

  it("someone on the family's curator list without the curator role is not a family curator", () => {
    const listed = person(IDS.familyCurator, "reviewer", "admin");
    expect(decideMove(listed, openFacts("under_review"), "accepted")).toMatchObject({ allowed: false, code: "forbidden:move" });
  });

  it("the author who is also a family curator cannot rule on their own proposal", () => {
    const both = person(IDS.author, "author", "curator");
    const facts = openFacts("under_review", { familyCuratorIds: [IDS.author, IDS.familyCurator] });
    expect(decideMove(both, facts, "accepted")).toMatchObject({ allowed: false, code: "forbidden:move" });
    expect(decideMove(both, facts, "declined", { reason: "changed my mind" })).toMatchObject({ allowed: false, code: "forbidden:move" });
    expect(decideMove(both, facts, "withdrawn")).toEqual({ allowed: true });
  });

  it("an unknown pair is an invalid transition even for the right person with every gate open", () => {
    expect(decideMove(curator, openFacts("draft"), "accepted")).toMatchObject({ allowed: false, code: "invalid:transition" });
    expect(decideMove(author, openFacts("released"), "withdrawn")).toMatchObject({ allowed: false, code: "invalid:transition" });
    expect(decideMove(curator, openFacts("under_review"), "under_review")).toMatchObject({ allowed: false, code: "invalid:transition" });
  });
});
