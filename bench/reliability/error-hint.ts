/**
 * The server's own account of a failure, from what it printed: the database's message (and table) when a query
 * failed, else the first error line. One short line for the report.
 */
export function errorHint(output: string): string | null {
  const table = output.match(/Failed query: (?:insert into|update|delete from|select [\s\S]*? from) "(\w+)"/)?.[1];
  const patterns = [
    /\[cause\]: (?:error|Error): ([^\n]+)/,
    /uncaughtException:\s+([^\n]+)/,
    /⨯ ([^\n]+)/,
    /\[bandgate\] (?:unexpected error|action failed) ([^\n]+)/,
    /\b((?:Type|Range|Syntax|URI)?Error: [^\n]+)/,
  ];
  for (const p of patterns) {
    const m = output.match(p);
    if (m) return `${m[1].trim().slice(0, 120)}${table && p === patterns[0] ? ` (query on ${table})` : ""}`;
  }
  return null;
}
