import { cellPlace, parseHeader } from "./csv-header";
import { isSkippedLine, readNumber, splitCells, splitLines } from "./csv-cells";
import { checkKValues } from "./k-checks";
import { fail, IssueList, REFERENCE_LIMITS, type KSource, type ParsedReferenceBands } from "./types";

/** Reads the CSV form (see docs/reference-bands.md); throws ReferenceBandsError naming line and column. */
export function parseReferenceCsv(text: string): ParsedReferenceBands {
  const lines = splitLines(text);
  const headerIndex = lines.findIndex((l) => !isSkippedLine(l));
  if (headerIndex < 0) fail({ message: "the file has no header row (only blank or '#' comment lines)" });
  const headerLine = headerIndex + 1;
  const headerCells = splitCells(lines[headerIndex]);
  if (!headerCells) fail({ line: headerLine, message: `line ${headerLine}: a quoted cell is not closed` });
  const header = parseHeader(headerCells, headerLine);
  const issues = new IssueList();
  const k: number[][] = [];
  const energies: (number | null)[][] = [];
  const kSources: KSource[] = [];
  for (let i = headerIndex + 1; i < lines.length; i++) {
    if (isSkippedLine(lines[i])) continue;
    const line = i + 1;
    if (k.length + 1 > REFERENCE_LIMITS.maxRows) {
      fail({ line, message: `line ${line}: too many rows: the limit is ${REFERENCE_LIMITS.maxRows} data rows` });
    }
    const cells = splitCells(lines[i]);
    if (!cells) {
      issues.add({ line, message: `line ${line}: a quoted cell is not closed` });
      continue;
    }
    if (cells.length !== headerCells.length) {
      // point at the first cell too many, or the first one missing
      const column = Math.min(cells.length, headerCells.length) + 1;
      const at = cellPlace(line, column, headerCells[column - 1]);
      issues.add({ line, column, message: `${at}: wrong number of cells: expected ${headerCells.length} as in the header (line ${headerLine}), found ${cells.length}` });
      continue;
    }
    const place = (c: number) => cellPlace(line, c + 1, headerCells[c]);
    const kRow: number[] = [];
    for (let c = 0; c < header.kColumns; c++) {
      const read = cells[c] === "" ? { problem: "k value missing: k cells must not be empty" } : readNumber(cells[c]);
      if ("problem" in read) issues.add({ line, column: c + 1, message: `${place(c)}: ${read.problem}` });
      else kRow.push(read.value * header.kFactor);
    }
    const row: (number | null)[] = [];
    for (let c = header.kColumns; c < cells.length; c++) {
      if (cells[c] === "") {
        row.push(null);
        continue;
      }
      const read = readNumber(cells[c]);
      if ("problem" in read) issues.add({ line, column: c + 1, message: `${place(c)}: ${read.problem}` });
      else row.push(read.value * header.bandFactors[c - header.kColumns]);
    }
    if (kRow.length !== header.kColumns || row.length !== header.bandFactors.length) continue;
    k.push(kRow);
    energies.push(row);
    kSources.push({ line, column: 1, where: place(0) });
  }
  issues.throwIfAny();
  if (k.length === 0) fail({ line: headerLine, message: `line ${headerLine}: the header has no data rows below it` });
  checkKValues(header.kKind, k, kSources, issues);
  issues.throwIfAny();
  return {
    kKind: header.kKind,
    k,
    energies,
    fermiLevel: null,
    bandCount: header.bandFactors.length,
    pointCount: k.length,
    kSources,
  };
}
