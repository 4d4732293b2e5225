/** Line and cell splitting for the reference-bands CSV form, and strict number reading. */

export function splitLines(text: string): string[] {
  return text.split(/\r\n|\n|\r/);
}

export function isSkippedLine(line: string): boolean {
  const t = line.trim();
  return t === "" || t.startsWith("#");
}

/**
 * Comma-separated cells, trimmed. A cell may be wrapped in double quotes (spreadsheets quote headers that
 * hold commas); inside quotes "" stands for one quote. Returns null on an unclosed quote.
 */
export function splitCells(line: string): string[] | null {
  const cells: string[] = [];
  let i = 0;
  for (;;) {
    while (line[i] === " " || line[i] === "\t") i++;
    if (line[i] === '"') {
      let cell = "";
      i++;
      for (;;) {
        if (i >= line.length) return null;
        if (line[i] === '"') {
          if (line[i + 1] === '"') {
            cell += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        cell += line[i++];
      }
      while (line[i] === " " || line[i] === "\t") i++;
      if (i < line.length && line[i] !== ",") return null;
      cells.push(cell.trim());
    } else {
      const end = line.indexOf(",", i);
      cells.push(line.slice(i, end < 0 ? line.length : end).trim());
      i = end < 0 ? line.length : end;
    }
    if (i >= line.length) return cells;
    i++;
  }
}

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const NOT_FINITE = /^[+-]?(?:nan|inf|infinity)$/i;

export type NumberRead = { value: number } | { problem: string };

/** A finite decimal number; explains what is wrong otherwise. */
export function readNumber(cell: string): NumberRead {
  if (NOT_FINITE.test(cell)) return { problem: `'${cell}' is not allowed: values must be finite numbers (no NaN or Infinity)` };
  if (!DECIMAL.test(cell)) return { problem: `'${cell}' is not a number` };
  const value = Number(cell);
  if (!Number.isFinite(value)) return { problem: `'${cell}' is too large to be a finite number` };
  return { value };
}
