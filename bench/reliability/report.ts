/** One goal of issue 11's figures: what was measured and whether it met the goal (null: the harness could not measure it). */
export interface GoalRow {
  figure: string;
  goal: string;
  measured: string;
  pass: boolean | null;
}

export function heading(title: string): void {
  console.log(`\n== ${title}`);
}

export function say(text: string): void {
  console.log(`  ${text}`);
}

export function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(ms < 10_000 ? 2 : 1)} s`;
}

function cell(text: string, width: number): string {
  return text.length > width ? `${text.slice(0, width - 1)}…` : text.padEnd(width);
}

/** The summary at the end: a fixed-width table, then the failed goals spelled out so they cannot be missed. */
export function printSummary(rows: GoalRow[]): void {
  heading("Summary (goals of issue 11)");
  const mark = (r: GoalRow) => (r.pass === null ? "NOT MEASURED" : r.pass ? "pass" : "FAIL");
  console.log(`  ${cell("figure", 12)} ${cell("goal", 52)} ${cell("result", 13)} measured`);
  for (const r of rows) console.log(`  ${cell(r.figure, 12)} ${cell(r.goal, 52)} ${cell(mark(r), 13)} ${r.measured}`);
  const failed = rows.filter((r) => r.pass !== true);
  if (failed.length === 0) {
    console.log("\n  All goals met.");
    return;
  }
  console.log(`\n  ${failed.length} of ${rows.length} goals NOT met:`);
  for (const r of failed) console.log(`   ✗ ${r.figure}: ${r.goal} — ${r.measured}`);
}
