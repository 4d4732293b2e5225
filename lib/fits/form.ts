import type { FitSpecInput } from "./spec";

/** The refit form as typed (strings), and its conversion to fit settings with messages for what cannot be read. */
export interface FitParameterRow {
  key: string;
  label: string;
  value: number;
  free: boolean;
  lower: string;
  upper: string;
}

export interface FitFormState {
  referenceSetId: string;
  rows: FitParameterRow[];
  bandOffset: string;
  windowLower: string;
  windowUpper: string;
  alignment: "none" | "vbm" | "least-squares";
  bandWeights: { band: string; weight: string }[];
  regionWeights: { from: string; to: string; weight: string }[];
  maxIterations: string;
  restarts: string;
  seed: string;
}

export function initialFitForm(parameters: { key: string; label: string; value: number }[], referenceSetId: string): FitFormState {
  return {
    referenceSetId,
    rows: parameters.map((p) => ({ ...p, free: false, lower: "", upper: "" })),
    bandOffset: "0",
    windowLower: "",
    windowUpper: "",
    alignment: "none",
    bandWeights: [],
    regionWeights: [],
    maxIterations: "200",
    restarts: "0",
    seed: "1",
  };
}

const DECIMAL = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/** "" → null; a number; or a message. Accepts a Unicode minus and a decimal comma, as people paste them. */
function readNumber(text: string, what: string, errors: string[]): number | null {
  const t = text.trim().replace("−", "-").replace(",", ".");
  if (t === "") return null;
  const v = DECIMAL.test(t) ? Number(t) : NaN;
  if (!Number.isFinite(v)) {
    errors.push(`${what}: "${text}" is not a number`);
    return null;
  }
  return v;
}

function required(text: string, what: string, errors: string[]): number {
  const v = readNumber(text, what, errors);
  if (v === null && text.trim() === "") errors.push(`${what} is required`);
  return v ?? NaN;
}

/**
 * The server's field errors ("parameters.0.upper": […]) in the form's words, e.g. "upper bound of ε(A, s): …", so a
 * message says which field to change.
 */
export function describeFieldErrors(fieldErrors: Record<string, string[]>, spec: FitSpecInput, labels: Record<string, string>): string[] {
  const name = (path: string): string => {
    const [head, index, field] = path.split(".");
    const i = Number(index);
    if (head === "parameters" && Number.isInteger(i)) {
      const key = spec.parameters[i]?.key ?? "";
      const label = labels[key] ?? key;
      return field === "lower" || field === "upper" ? `${field} bound of ${label}` : label;
    }
    if (head === "bandWeights" && Number.isInteger(i)) return `band weight row ${i + 1}`;
    if (head === "regionWeights" && Number.isInteger(i)) return `region ${i + 1}`;
    const words: Record<string, string> = { window: "window", bandOffset: "band offset", maxIterations: "maximum iterations", restarts: "extra starts", seed: "seed", referenceSetId: "reference band set", parameters: "free parameters", alignment: "alignment" };
    return words[head] ?? path;
  };
  return Object.entries(fieldErrors).flatMap(([path, messages]) => messages.map((m) => `${name(path)}: ${m}`));
}

/** Checks that need the reference's shape (known once a reference set is chosen). */
export function checkAgainstReference(spec: FitSpecInput, bandCount: number): string[] {
  return (spec.bandWeights ?? []).flatMap((w, i) =>
    Number.isInteger(w.band) && (w.band < 0 || w.band >= bandCount) ? [`band weight row ${i + 1}: the reference has bands 0–${bandCount - 1} only`] : [],
  );
}

export function toFitSpec(state: FitFormState): { spec: FitSpecInput; errors: string[] } {
  const errors: string[] = [];
  const parameters = state.rows
    .filter((r) => r.free)
    .map((r) => ({ key: r.key, lower: readNumber(r.lower, `lower bound of ${r.label}`, errors), upper: readNumber(r.upper, `upper bound of ${r.label}`, errors) }));
  const lo = readNumber(state.windowLower, "window lower edge", errors);
  const hi = readNumber(state.windowUpper, "window upper edge", errors);
  if ((lo === null) !== (hi === null)) errors.push("give both window edges, or neither for every energy");
  const spec: FitSpecInput = {
    referenceSetId: state.referenceSetId,
    parameters,
    bandOffset: required(state.bandOffset, "band offset", errors),
    window: lo !== null && hi !== null ? [lo, hi] : null,
    alignment: state.alignment,
    bandWeights: state.bandWeights.map((w, i) => ({ band: required(w.band, `band of weight row ${i + 1}`, errors), weight: required(w.weight, `weight row ${i + 1}`, errors) })),
    regionWeights: state.regionWeights.map((w, i) => ({
      from: required(w.from, `start of region ${i + 1}`, errors),
      to: required(w.to, `end of region ${i + 1}`, errors),
      weight: required(w.weight, `weight of region ${i + 1}`, errors),
    })),
    maxIterations: required(state.maxIterations, "maximum iterations", errors),
    restarts: required(state.restarts, "extra starts", errors),
    seed: required(state.seed, "seed", errors),
  };
  if (parameters.length === 0) errors.push("choose at least one parameter to fit (tick “free”)");
  return { spec, errors };
}
