import { describe, expect, it } from "vitest";
import { decideMove, moveHints, type MoveHint, type ProposalFacts } from "@/board/rules";
import type { Stage } from "@/board/stages";
import { closedFacts, openFacts, placeActor } from "./helpers/facts";
import { expectedHintFailures, SPEC_STAGES, SPEC_TABLE, specMayMake } from "./helpers/oracle";
import { actorAt, IDS, person, POSITIONS, ROLE_COMBOS, rolesLabel } from "./helpers/people";

type Shape = { to: Stage; allowed: boolean; needsReason: boolean; reasonCount: number };
const byStage = (a: Shape, b: Shape) => a.to.localeCompare(b.to);
const shape = (h: MoveHint): Shape => ({ to: h.to, allowed: h.allowed, needsReason: h.needsReason, reasonCount: h.reasons.length });

const FACTS: { name: string; build: (s: Stage) => ProposalFacts }[] = [
  { name: "gates open", build: (s) => openFacts(s) },
  { name: "gates failing", build: (s) => closedFacts(s) },
  { name: "gates failing, checks ran and fail", build: (s) => closedFacts(s, { checksRun: true }) },
];

describe.each(FACTS)("moveHints for every role combination × position × stage: $name", ({ build }) => {
  for (const roles of ROLE_COMBOS) {
    it.each(POSITIONS)(`${rolesLabel(roles)} as %s`, (position) => {
      const actor = actorAt(position, roles);
      for (const stage of SPEC_STAGES) {
        const facts = placeActor(build(stage), position);
        const expected = Object.entries(SPEC_TABLE[stage] ?? {})
          .filter(([to, row]) => to !== "released" && row && specMayMake(row, actor, facts))
          .map(([to, row]): Shape => {
            const failing = expectedHintFailures(row!, facts);
            return { to: to as Stage, allowed: failing.length === 0, needsReason: row!.reason, reasonCount: failing.length };
          });
        const actual = moveHints(actor, facts);
        expect(actual.map(shape).sort(byStage), stage).toEqual(expected.sort(byStage));
        for (const hint of actual) {
          const decision = decideMove(actor, facts, hint.to, { reason: "a written reason" });
          expect(decision.allowed, `${stage} → ${hint.to}: hint and decision agree`).toBe(hint.allowed);
          if (!decision.allowed) expect(decision.reasons, `${stage} → ${hint.to}`).toEqual(hint.reasons);
        }
      }
    });
  }
});

describe("moveHints anchors", () => {
  const author = person(IDS.author, "author");
  const curator = person(IDS.familyCurator, "curator");

  it("never offers released, even to the family curator of an accepted proposal", () => {
    expect(moveHints(curator, openFacts("accepted"))).toEqual([]);
  });

  it("offers nothing out of a closed stage", () => {
    for (const stage of ["released", "declined", "withdrawn"] as const) {
      expect(moveHints(author, openFacts(stage))).toEqual([]);
      expect(moveHints(curator, openFacts(stage))).toEqual([]);
    }
  });

  it("offers the author submit and withdraw from a draft, with the missing checks on submit", () => {
    const hints = moveHints(author, openFacts("draft", { checksRun: false }));
    expect(hints.map((h) => h.to).sort()).toEqual(["submitted", "withdrawn"]);
    const submit = hints.find((h) => h.to === "submitted");
    expect(submit).toMatchObject({ allowed: false, needsReason: false });
    expect(submit?.reasons).toHaveLength(1);
    expect(hints.find((h) => h.to === "withdrawn")).toEqual({ to: "withdrawn", allowed: true, needsReason: false, reasons: [] });
  });

  it("offers the curator of a review the three rulings, marking which need a reason", () => {
    const hints = moveHints(curator, openFacts("under_review"));
    expect(hints.map((h) => [h.to, h.needsReason]).sort()).toEqual([["accepted", false], ["declined", true], ["revision", true]]);
  });

  it("offers a stranger, an admin and an assigned reviewer nothing", () => {
    for (const actor of [person(IDS.stranger), person(IDS.stranger, "admin"), person(IDS.assignedReviewer, "reviewer")]) {
      for (const stage of SPEC_STAGES) expect(moveHints(actor, openFacts(stage))).toEqual([]);
    }
  });
});
