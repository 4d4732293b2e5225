import type { IssueList, KKind, KSource } from "./types";

/** How another message refers back to a point: "line 9" or "k.values[3]". */
export function pointRef(source: KSource): string {
  return source.line !== undefined ? `line ${source.line}` : source.where;
}

export function issueAt(source: KSource, message: string) {
  return { line: source.line, column: source.column, path: source.path, message: `${source.where}: ${message}` };
}

/**
 * Checks that need only the file: indices are whole and unique, path distances never decrease (one repeat is
 * allowed, for a jump in the path; resolving checks that the path jumps there), fractional points do not repeat
 * on consecutive rows (a path may come back to a point, as fcc paths return to Γ).
 */
export function checkKValues(kind: KKind, k: number[][], sources: KSource[], issues: IssueList): void {
  const seen = new Map<number, number>();
  k.forEach((row, i) => {
    const s = sources[i];
    const prev = i > 0 ? k[i - 1] : null;
    if (kind === "index") {
      const v = row[0];
      if (!Number.isInteger(v) || v < 0) return issues.add(issueAt(s, `k_index must be a whole number ≥ 0, found ${v}`));
      const first = seen.get(v);
      if (first !== undefined) issues.add(issueAt(s, `duplicate k: index ${v} is already on ${pointRef(sources[first])}`));
      else seen.set(v, i);
    } else if (kind === "path") {
      const v = row[0];
      if (v < 0) return issues.add(issueAt(s, `k_path must not be negative, found ${v}`));
      if (!prev) return;
      if (v < prev[0]) {
        issues.add(issueAt(s, `non-increasing k_path: ${v} comes after ${prev[0]} on ${pointRef(sources[i - 1])}; distances along the path must increase`));
      } else if (v === prev[0] && i > 1 && k[i - 2][0] === v) {
        issues.add(issueAt(s, `duplicate k: distance ${v} already appears twice, on ${pointRef(sources[i - 2])} and ${pointRef(sources[i - 1])}`));
      }
    } else if (prev && prev.length === row.length && prev.every((x, c) => x === row[c])) {
      issues.add(issueAt(s, `duplicate k: the point (${row.join(", ")}) repeats ${pointRef(sources[i - 1])}`));
    }
  });
}
