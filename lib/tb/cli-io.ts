import { readFileSync } from "node:fs";
import { ModelDocumentError, parseModelDocument, type ModelDocument } from "./document";

/** A problem with the user's input: printed as one clear message, exit code 2. */
export class InputError extends Error {}

export function readJsonFile(path: string | undefined, what: string): unknown {
  if (!path) throw new InputError(`missing ${what} file argument`);
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (e) {
    throw new InputError(`cannot read ${what} file ${path}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new InputError(`${what} file ${path} is not valid JSON: ${(e as Error).message}`);
  }
}

export function readModel(path: string | undefined): ModelDocument {
  const raw = readJsonFile(path, "model");
  try {
    return parseModelDocument(raw);
  } catch (e) {
    if (e instanceof ModelDocumentError) {
      throw new InputError(`model file ${path} is not a valid model document:\n${e.issues.map((i) => `  ${i.path || "(document)"}: ${i.message}`).join("\n")}`);
    }
    throw e;
  }
}

/** Reads {"fractional": [[k1, k2, k3], ...]} with `dimension` components per point. */
export function readKPoints(path: string | undefined, dimension: number): number[][] {
  const raw = readJsonFile(path, "k-points");
  const list = (raw as { fractional?: unknown })?.fractional;
  if (!Array.isArray(list)) throw new InputError(`k-points file ${path} needs {"fractional": [[k1, ...], ...]}`);
  list.forEach((k, i) => {
    if (!Array.isArray(k) || k.length !== dimension || !k.every((x) => typeof x === "number" && Number.isFinite(x))) {
      throw new InputError(`k-points file ${path}: fractional[${i}] must hold ${dimension} finite numbers (the lattice dimension)`);
    }
  });
  return list as number[][];
}

/** Value of `--name VALUE` in argv, or undefined. */
export function option(args: string[], name: string): string | undefined {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : undefined;
}

export function positional(args: string[]): string | undefined {
  return args.find((a, i) => !a.startsWith("--") && !(i > 0 && args[i - 1].startsWith("--")));
}
