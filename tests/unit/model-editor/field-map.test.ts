import { describe, expect, it } from "vitest";
import { validateModelDocument } from "@/lib/tb/document";
import diamond from "@/db/seed/models/demo-diamond-sp3s.json";
import type { Draft } from "@/app/_components/model-editor/draft-path";
import { setAt } from "@/app/_components/model-editor/draft-path";
import { editorFields, fieldForIssue, sectionForIssue } from "@/app/_components/model-editor/field-map";

const FIELDS = ["sites[0].position[1]", "shells[1].index", "shells[10].distance", "validity.strain[0]", "validity.strain[1]", "onsite.X.s", "onsite.X.px"];

describe("issue path → editor field", () => {
  it("takes the field at the issue's own path", () => {
    expect(fieldForIssue("shells[1].index", FIELDS)).toBe("shells[1].index");
  });
  it("sends a whole-range issue to the range's first bound", () => {
    expect(fieldForIssue("validity.strain", FIELDS)).toBe("validity.strain[0]");
  });
  it("respects index boundaries: shells[1] is not shells[10]", () => {
    expect(fieldForIssue("shells[10]", FIELDS)).toBe("shells[10].distance");
    expect(fieldForIssue("shells[1]", FIELDS)).toBe("shells[1].index");
  });
  it("falls back to the nearest field one level up for a key the editor does not draw", () => {
    expect(fieldForIssue("onsite.X.f", FIELDS)).toBe("onsite.X.s");
  });
  it("finds no field for a document-level issue and files it under the header", () => {
    expect(fieldForIssue("", FIELDS)).toBeNull();
    expect(sectionForIssue("")).toBe("document");
    expect(sectionForIssue("provenance.citations.onsite/X/s")).toBe("citations");
    expect(sectionForIssue("shells[0].params.sp_sigma")).toBe("bonds");
  });
  it("every error the engine's validator raises on a broken seed document lands on a drawn field", () => {
    let draft = structuredClone(diamond) as Draft;
    draft = setAt(draft, ["shells", 0, "params", "sp_sigma"], undefined);
    draft = setAt(draft, ["onsite", "X", "px"], "1.6x");
    draft = setAt(draft, ["sites", 1, "position", 2], null);
    draft = setAt(draft, ["validity", "strain"], [0.02, -0.02]);
    const issues = validateModelDocument(draft).errors;
    expect(issues.length).toBeGreaterThan(0);
    const fields = editorFields(draft, []);
    const mapped = issues.map((i) => fieldForIssue(i.path, fields));
    expect(mapped).toEqual(expect.arrayContaining(["onsite.X.px", "sites[1].position[2]", "validity.strain[0]"]));
    expect(mapped).not.toContain(null);
  });
  it("a missing Slater–Koster integral (a meaning check, past the schema) lands on its own input", () => {
    const draft = setAt(structuredClone(diamond) as Draft, ["shells", 0, "params", "sp_sigma"], undefined);
    const issues = validateModelDocument(draft).errors;
    expect(issues.map((i) => fieldForIssue(i.path, editorFields(draft, [])))).toContain("shells[0].params.sp_sigma");
  });
});
