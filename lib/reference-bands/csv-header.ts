import { IssueList, REFERENCE_LIMITS, ReferenceBandsError, type KKind } from "./types";
import { ENERGY_UNIT_FACTORS, ENERGY_UNITS_HINT, energyUnitOf, inverseLengthFactor, PATH_UNITS_HINT } from "./units";

export interface CsvHeader {
  kKind: KKind;
  /** Number of leading k columns (1, or the lattice dimension for fractional). */
  kColumns: number;
  /** Multiplies k_path values into 1/Å. */
  kFactor: number;
  /** Multiplies each band column into eV. */
  bandFactors: number[];
  names: string[];
}

export function cellPlace(line: number, column: number, name?: string): string {
  return name ? `line ${line}, column ${column} (${name})` : `line ${line}, column ${column}`;
}

/** "E2 (eV)" or "band_2 [eV]" → name and unit; unit null when there is none. */
function splitUnit(header: string): { name: string; unit: string | null } {
  const m = /^(.*?)\s*(?:\(([^()]*)\)|\[([^[\]]*)\])$/.exec(header);
  if (!m) return { name: header, unit: null };
  return { name: m[1], unit: (m[2] ?? m[3]).trim() };
}

const FRACTIONAL_UNITS = new Set(["fractional", "frac", "reduced"]);

function readKColumns(cells: string[], line: number, issues: IssueList): Omit<CsvHeader, "bandFactors" | "names"> | null {
  const first = splitUnit(cells[0]);
  const name = first.name.toLowerCase();
  const add = (column: number, message: string) => issues.add({ line, column, message: `${cellPlace(line, column, cells[column - 1])}: ${message}` });
  if (name === "k_index") {
    if (first.unit !== null) add(1, "k_index counts points along the path and takes no unit");
    return { kKind: "index", kColumns: 1, kFactor: 1 };
  }
  if (name === "k_path") {
    if (first.unit === null || first.unit === "") {
      add(1, `missing unit: k_path needs one, e.g. 'k_path (1/angstrom)'`);
      return null;
    }
    const factor = inverseLengthFactor(first.unit);
    if (factor === null) add(1, `unknown unit '${first.unit}' for k_path (expected ${PATH_UNITS_HINT})`);
    return { kKind: "path", kColumns: 1, kFactor: factor ?? 1 };
  }
  if (name === "k1") {
    let count = 0;
    while (count < 3 && count < cells.length) {
      const c = splitUnit(cells[count]);
      if (c.name.toLowerCase() !== `k${count + 1}`) break;
      if (c.unit !== null && !FRACTIONAL_UNITS.has(c.unit.toLowerCase())) {
        add(count + 1, `unknown unit '${c.unit}' for k${count + 1}: fractional coordinates take no unit (or '(fractional)')`);
      }
      count++;
    }
    return { kKind: "fractional", kColumns: count, kFactor: 1 };
  }
  add(1, `the first column must name the k coordinate: k_index, k_path (unit) or k1, k2, k3; found '${cells[0]}'`);
  return null;
}

const BAND_NAME = /^(?:e|band)_?(\d+)$/i;

export function parseHeader(cells: string[], line: number): CsvHeader {
  const issues = new IssueList();
  const k = readKColumns(cells, line, issues);
  if (!k) throw new ReferenceBandsError(issues.items);
  const { kColumns } = k;
  const bandCount = cells.length - kColumns;
  if (bandCount > REFERENCE_LIMITS.maxBands) {
    const column = kColumns + REFERENCE_LIMITS.maxBands + 1;
    issues.add({ line, column, message: `${cellPlace(line, column, cells[column - 1])}: too many columns: ${bandCount} band columns, the limit is ${REFERENCE_LIMITS.maxBands}` });
  }
  if (bandCount < 1) issues.add({ line, message: `line ${line}: no band columns after the k column(s); add e.g. 'E1 (eV)'` });
  issues.throwIfAny();
  const bandFactors: number[] = [];
  for (let b = 0; b < bandCount; b++) {
    const column = kColumns + b + 1;
    const header = cells[column - 1];
    const add = (message: string) => issues.add({ line, column, message: `${cellPlace(line, column, header)}: ${message}` });
    const { name, unit } = splitUnit(header);
    const m = BAND_NAME.exec(name);
    if (!m) add(`not a band column: expected 'E${b + 1} (eV)' or 'band_${b + 1} [eV]'`);
    else if (Number(m[1]) !== b + 1) add(`bands must be numbered 1, 2, 3… in column order: expected band ${b + 1} here, found ${m[1]}`);
    if (unit === null || unit === "") {
      add(`missing unit: write e.g. 'E${b + 1} (eV)' (${ENERGY_UNITS_HINT})`);
      continue;
    }
    const energyUnit = energyUnitOf(unit);
    if (energyUnit === null) add(`unknown unit '${unit}' (expected ${ENERGY_UNITS_HINT})`);
    else bandFactors.push(ENERGY_UNIT_FACTORS[energyUnit]);
  }
  issues.throwIfAny();
  return { ...k, bandFactors, names: cells };
}
