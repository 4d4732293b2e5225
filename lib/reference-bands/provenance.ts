import { z } from "zod";

const MAX = 500;

function text(label: string, example: string) {
  const required = `${label} is required, e.g. "${example}"`;
  return z
    .string({ error: (issue) => (issue.input === undefined ? required : `${label} must be text`) })
    .trim()
    .min(1, { error: required })
    .max(MAX, { error: `${label} must be at most ${MAX} characters` });
}

function optionalText(label: string) {
  return z
    .string({ error: `${label} must be text` })
    .trim()
    .max(MAX, { error: `${label} must be at most ${MAX} characters` })
    .optional();
}

/** Where uploaded reference bands come from; required with every upload. */
export const REFERENCE_PROVENANCE_SCHEMA = z.strictObject({
  method: text("method", "DFT-PBE"),
  functional: optionalText("functional"),
  code: text("code", "the program's name and version"),
  structureSource: text("structureSource", "relaxed, a = 5.431 Å"),
  alignmentNote: optionalText("alignmentNote"),
  notes: optionalText("notes"),
});

export type ReferenceProvenance = z.infer<typeof REFERENCE_PROVENANCE_SCHEMA>;
