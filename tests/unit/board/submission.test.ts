import { describe, expect, it } from "vitest";
import { decideMove } from "@/board/rules";
import { changedParameters, submissionProblems } from "@/board/submission";
import type { ModelDocument } from "@/lib/tb/document";
import { listParameters, setParameters } from "@/lib/tb/parameters";
import { openFacts } from "./helpers/facts";
import { IDS, person } from "./helpers/people";
import { completeDocument, SEED_NAMES, seedDocument } from "./helpers/seed-documents";

type Provenance = ModelDocument["provenance"];
const withProvenance = (doc: ModelDocument, change: Partial<Provenance>): ModelDocument => ({ ...doc, provenance: { ...doc.provenance, ...change } });

const REQUIRED: { field: keyof Provenance; named: RegExp }[] = [
  { field: "referenceMethod", named: /reference method/i },
  { field: "referenceCode", named: /code/i },
  { field: "functional", named: /functional/i },
  { field: "structureSource", named: /structure/i },
  { field: "kMesh", named: /k-?mesh/i },
];

describe("submissionProblems on the demo documents", () => {
  it.each(SEED_NAMES)("%s as seeded lacks code, functional and k-mesh, and nothing else", (name) => {
    const problems = submissionProblems(null, seedDocument(name));
    expect(problems).toHaveLength(3);
    for (const named of [/code/i, /functional/i, /k-?mesh/i]) expect(problems.some((p) => named.test(p)), String(named)).toBe(true);
  });

  it.each(SEED_NAMES)("%s with complete provenance has no problems, against a blank base and against itself", (name) => {
    const doc = completeDocument(name);
    expect(submissionProblems(null, doc)).toEqual([]);
    expect(submissionProblems(completeDocument(name), doc)).toEqual([]);
  });
});

describe("provenance fields", () => {
  const complete = completeDocument("demo-diamond-sp3s");

  it.each(REQUIRED)("$field missing, empty or whitespace is exactly one problem naming it", ({ field, named }) => {
    for (const value of [undefined, "", "   \t"]) {
      const problems = submissionProblems(complete, withProvenance(complete, { [field]: value }));
      expect(problems, JSON.stringify(value)).toHaveLength(1);
      expect(problems[0]).toMatch(named);
    }
  });

  it("all five missing are five distinct problems", () => {
    const blanked = withProvenance(complete, Object.fromEntries(REQUIRED.map(({ field }) => [field, " "])));
    const problems = submissionProblems(complete, blanked);
    expect(problems).toHaveLength(5);
    expect(new Set(problems).size).toBe(5);
  });

  it("fit window and fit weights go together", () => {
    const fit = (change: Partial<Provenance>) => submissionProblems(complete, withProvenance(complete, change));
    expect(fit({ fitWindow: undefined, fitWeights: undefined })).toEqual([]);
    expect(fit({ fitWindow: [-5, 3], fitWeights: "uniform over the window" })).toEqual([]);
    expect(fit({ fitWindow: [-5, 3], fitWeights: undefined })).toHaveLength(1);
    expect(fit({ fitWindow: [-5, 3], fitWeights: "  " })).toHaveLength(1);
    expect(fit({ fitWindow: undefined, fitWeights: "uniform" })).toHaveLength(1);
    expect(fit({ fitWindow: [-5, 3] })[0]).not.toBe(fit({ fitWeights: "uniform" })[0]);
  });
});

describe("validity range", () => {
  const complete = completeDocument("demo-honeycomb-pz");
  const withValidity = (validity: ModelDocument["validity"]) => submissionProblems(complete, { ...complete, validity });

  it("none of strain, temperature or energy window is one problem, notes alone do not count", () => {
    expect(withValidity({})).toHaveLength(1);
    expect(withValidity({ notes: "valid near the Fermi level" })).toHaveLength(1);
  });

  it("any one of the three is enough", () => {
    expect(withValidity({ strain: [-0.01, 0.01] })).toEqual([]);
    expect(withValidity({ temperature: [0, 300] })).toEqual([]);
    expect(withValidity({ energyWindow: [-3, 3] })).toEqual([]);
  });
});

describe("citations of changed parameters", () => {
  const base = completeDocument("demo-sp-chain");
  const KEY = "shell/A-A/1/sp_sigma";
  const withoutCitation = (doc: ModelDocument, key: string) => {
    const citations = { ...doc.provenance.citations };
    delete citations[key];
    return withProvenance(doc, { citations });
  };

  it("a changed parameter without a citation is one problem naming its key; adding one removes it", () => {
    const changed = withoutCitation(setParameters(base, { [KEY]: base.shells[0].params.sp_sigma + 0.1 }), KEY);
    const problems = submissionProblems(base, changed);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain(KEY);
    expect(submissionProblems(base, withProvenance(changed, { citations: { ...changed.provenance.citations, [KEY]: "refit to new reference" } }))).toEqual([]);
  });

  it("a blank citation counts as missing", () => {
    const changed = setParameters(base, { [KEY]: 2.5 });
    expect(submissionProblems(base, withProvenance(changed, { citations: { ...changed.provenance.citations, [KEY]: "   " } }))).toHaveLength(1);
  });

  it("an unchanged parameter needs no citation when there is a base", () => {
    expect(submissionProblems(base, withoutCitation(base, KEY))).toEqual([]);
  });

  it("against a blank base every parameter is new and needs a citation", () => {
    const bare = withProvenance(base, { citations: {} });
    const keys = listParameters(bare).map((p) => p.key);
    const problems = submissionProblems(null, bare);
    expect(problems).toHaveLength(keys.length);
    for (const key of keys) expect(problems.some((p) => p.includes(key)), key).toBe(true);
    expect(submissionProblems(null, withoutCitation(base, "onsite/A/pz"))).toHaveLength(1);
  });

  it("a parameter added by the proposal needs a citation", () => {
    const diamond = completeDocument("demo-diamond-sp3s");
    const added = { ...diamond, spinOrbit: { X: 0.02 } };
    expect(submissionProblems(diamond, added)).toHaveLength(1);
    expect(submissionProblems(diamond, withProvenance(added, { citations: { ...added.provenance.citations, "soc/X": "illustrative value for the test" } }))).toEqual([]);
  });

  it("several changed parameters are each listed", () => {
    const keys = ["onsite/A/s", "onsite/A/pz", KEY];
    const changed = setParameters(base, Object.fromEntries(keys.map((k) => [k, 0.123])));
    expect(submissionProblems(base, withProvenance(changed, { citations: {} }))).toHaveLength(3);
  });
});

describe("changedParameters", () => {
  const base = completeDocument("demo-sp-chain");
  it("lists a changed value with both sides, and nothing for an identical document", () => {
    expect(changedParameters(base, completeDocument("demo-sp-chain"))).toEqual([]);
    const [change, ...rest] = changedParameters(base, setParameters(base, { "onsite/A/s": -4.5 }));
    expect(rest).toEqual([]);
    expect(change).toMatchObject({ key: "onsite/A/s", base: -5, proposed: -4.5 });
  });
  it("against a blank base lists every parameter as new", () => {
    expect(changedParameters(null, base)).toHaveLength(listParameters(base).length);
    expect(changedParameters(null, base).every((c) => c.base === null)).toBe(true);
  });
});

describe("submission problems feed the submit gate", () => {
  it("a seed draft is refused with each of its problems; the completed one is allowed", () => {
    const problems = submissionProblems(null, seedDocument("demo-diamond-sp3s"));
    const refused = decideMove(person(IDS.author), openFacts("draft", { submissionProblems: problems }), "submitted");
    expect(refused).toEqual({ allowed: false, code: "refused:gate", reasons: problems });
    const fixed = submissionProblems(null, completeDocument("demo-diamond-sp3s"));
    expect(decideMove(person(IDS.author), openFacts("draft", { submissionProblems: fixed }), "submitted")).toEqual({ allowed: true });
  });
});
