/**
 * The server's own account of a failure, from what it printed: the database's message (and table) when a query
 * failed, else the first error line; what ended a process comes first. One short line for the report.
 */
export function errorHint(output: string): string | null {
  const table = output.match(/Failed query: (?:insert into|update|delete from|select [\s\S]*? from) "(\w+)"/)?.[1];
  const patterns = [
    /uncaughtException:\s+([^\n]+)/,
    /(Unhandled 'error' event)[^\n]*\n[^\n]*\n\s*([^\n]+)/,
    /\[cause\]: (?:error|Error): ([^\n]+)/,
    /⨯ ([^\n]+)/,
    /\[bandgate\] (?:unexpected error|action failed) ([^\n]+)/,
    /\b((?:Type|Range|Syntax|URI)?Error: [^\n]+)/,
  ];
  for (const p of patterns) {
    const m = output.match(p);
    if (m) return `${m.slice(1).join(": ").trim().slice(0, 120)}${table && p === patterns[2] ? ` (query on ${table})` : ""}`;
  }
  return null;
}
