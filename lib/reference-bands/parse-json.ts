import { z } from "zod";
import { checkKValues } from "./k-checks";
import { fail, IssueList, REFERENCE_LIMITS, ReferenceBandsError, type KSource, type ParsedReferenceBands } from "./types";
import { ENERGY_UNIT_FACTORS } from "./units";

const finite = z.number({ error: "must be a finite number" });

export const REFERENCE_BANDS_JSON_SCHEMA = z.strictObject({
  format: z.literal("bandgate-reference-bands", { error: "must be \"bandgate-reference-bands\"" }),
  version: z.literal(1, { error: "must be 1" }),
  energyUnit: z.enum(["eV", "meV", "Ry", "Hartree"], { error: "must be one of eV, meV, Ry, Hartree" }),
  k: z.discriminatedUnion(
    "kind",
    [
      z.strictObject({ kind: z.literal("index"), values: z.array(z.number().int({ error: "must be a whole number" }).min(0, { error: "must be ≥ 0" })) }),
      z.strictObject({ kind: z.literal("path"), values: z.array(finite.min(0, { error: "must be ≥ 0" })).describe("1/Å along the default path") }),
      z.strictObject({ kind: z.literal("fractional"), values: z.array(z.array(finite).min(1).max(3)) }),
    ],
    { error: "must be \"index\", \"path\" or \"fractional\"" },
  ),
  energies: z.array(z.array(finite.nullable())).describe("one row per k-point, in energyUnit; null where missing"),
  fermiLevel: finite.optional().describe("in energyUnit"),
});

/** ["energies", 3, 2] → "energies[3][2]". */
export function jsonPath(path: readonly PropertyKey[]): string {
  if (path.length === 0) return "(top level)";
  return path.map((p, i) => (typeof p === "number" ? `[${p}]` : i === 0 ? String(p) : `.${String(p)}`)).join("");
}

function syntaxIssue(text: string, error: unknown): never {
  const message = error instanceof Error ? error.message : String(error);
  const at = /position (\d+)/.exec(message);
  if (!at) fail({ message: `not valid JSON: ${message}` });
  const before = text.slice(0, Number(at[1])).split(/\r\n|\n|\r/);
  const line = before.length, column = before[before.length - 1].length + 1;
  fail({ line, column, message: `line ${line}, column ${column}: not valid JSON: ${message}` });
}

/** Reads the JSON form (see docs/reference-bands.md); throws ReferenceBandsError with JSON paths. */
export function parseReferenceJson(text: string): ParsedReferenceBands {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    syntaxIssue(text, error);
  }
  const parsed = REFERENCE_BANDS_JSON_SCHEMA.safeParse(raw);
  if (!parsed.success) {
    throw new ReferenceBandsError(
      parsed.error.issues.map((i) => ({ path: jsonPath(i.path), message: `${jsonPath(i.path)}: ${i.message}` })),
    );
  }
  const data = parsed.data;
  const values: number[][] = data.k.kind === "fractional" ? data.k.values : data.k.values.map((v) => [v]);
  const issues = new IssueList();
  const add = (path: string, message: string) => issues.add({ path, message: `${path}: ${message}` });
  if (values.length > REFERENCE_LIMITS.maxRows) add("k.values", `too many rows: ${values.length} points, the limit is ${REFERENCE_LIMITS.maxRows}`);
  if (values.length === 0) add("k.values", "no points");
  if (data.energies.length !== values.length) add("energies", `expected one row per k-point (${values.length}), found ${data.energies.length}`);
  const bandCount = data.energies[0]?.length ?? 0;
  if (bandCount > REFERENCE_LIMITS.maxBands) add("energies[0]", `too many bands: ${bandCount}, the limit is ${REFERENCE_LIMITS.maxBands}`);
  if (bandCount === 0 && data.energies.length > 0) add("energies[0]", "no bands");
  issues.throwIfAny();
  data.energies.forEach((row, i) => {
    if (row.length !== bandCount) add(`energies[${i}]`, `expected ${bandCount} values as in energies[0], found ${row.length}`);
  });
  values.forEach((row, i) => {
    if (row.length !== values[0].length) add(`k.values[${i}]`, `expected ${values[0].length} coordinates as in k.values[0], found ${row.length}`);
  });
  const kSources: KSource[] = values.map((_, i) => ({ path: `k.values[${i}]`, where: `k.values[${i}]` }));
  issues.throwIfAny();
  checkKValues(data.k.kind, values, kSources, issues);
  issues.throwIfAny();
  const factor = ENERGY_UNIT_FACTORS[data.energyUnit];
  return {
    kKind: data.k.kind,
    k: values.map((row) => row.slice()),
    energies: data.energies.map((row) => row.map((e) => (e === null ? null : e * factor))),
    fermiLevel: data.fermiLevel === undefined ? null : data.fermiLevel * factor,
    bandCount,
    pointCount: values.length,
    kSources,
  };
}
