import { formatNumber } from "@/lib/review/band-format";
import type { MetricsRow } from "@/lib/review/metrics";

const GROUPS: { test: (key: string) => boolean; title: string }[] = [
  { test: (k) => k.startsWith("gap"), title: "Gap" },
  { test: (k) => k.startsWith("mass/") || k === "free-electron", title: "Effective masses (m*/mₑ; negative at a maximum)" },
  { test: (k) => k.startsWith("width/"), title: "Bandwidths" },
  { test: () => true, title: "Against the reference, inside the window" },
];

function groupOf(key: string): string {
  return (GROUPS.find((g) => g.test(key)) ?? GROUPS[GROUPS.length - 1]).title;
}

const CELL = "px-3 py-1.5";
/** Rows where proposed − base means nothing: bookkeeping of the reference comparison. */
const NO_DELTA = new Set(["points", "shift"]);
const NUM = `num whitespace-nowrap text-right ${CELL}`;

function Value({ text, numeric }: { text: string; numeric: boolean }) {
  return <td className={numeric ? NUM : `${CELL} text-right`}>{text}</td>;
}

function deltaText(delta: number | null, digits: number): string {
  if (delta === null) return "";
  const text = formatNumber(delta, digits);
  return delta > 0 && /[1-9]/.test(text) ? `+${text}` : text;
}

/** Base vs proposed vs reference, grouped; Δ = proposed − base for numeric rows. */
export function MetricsTable({ rows }: { rows: MetricsRow[] }) {
  const groups: { title: string; rows: MetricsRow[] }[] = [];
  for (const r of rows) {
    const title = groupOf(r.key);
    const last = groups[groups.length - 1];
    if (last?.title === title) last.rows.push(r);
    else groups.push({ title, rows: [r] });
  }
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-card">
      <table className="w-full text-sm" aria-label="Band metrics: base, proposed and reference">
        <thead className="border-b border-rule text-xs text-ink-soft">
          <tr>
            <th scope="col" className={`${CELL} text-left font-semibold`}>Metric</th>
            <th scope="col" className={`${CELL} text-right font-semibold`}>Base</th>
            <th scope="col" className={`${CELL} text-right font-semibold`}>Proposed</th>
            <th scope="col" className={`${CELL} text-right font-semibold`}>Δ</th>
            <th scope="col" className={`${CELL} text-right font-semibold`}>Reference</th>
            <th scope="col" className={`${CELL} text-left font-semibold`}>Unit</th>
          </tr>
        </thead>
        {groups.map((g) => (
          <tbody key={g.title} className="divide-y divide-rule/60">
            <tr className="bg-paper-deep/60">
              <th scope="rowgroup" colSpan={6} className={`${CELL} text-left text-xs font-semibold text-ink-soft`}>
                {g.title}
              </th>
            </tr>
            {g.rows.map((r) => {
              const numeric = r.unit !== "" || r.key === "points";
              const { base, proposed } = r.values;
              const delta = numeric && !NO_DELTA.has(r.key) && base !== null && proposed !== null ? proposed - base : null;
              return (
                <tr key={r.key} id={`metric-${r.key}`}>
                  <th scope="row" className={`${CELL} text-left font-normal`}>
                    {r.metric}
                  </th>
                  <Value text={r.base} numeric={numeric} />
                  <Value text={r.proposed} numeric={numeric} />
                  <td className={NUM}>{deltaText(delta, r.key === "points" ? 0 : 3)}</td>
                  <Value text={r.reference} numeric={numeric} />
                  <td className={`${CELL} text-xs text-ink-soft`}>{r.unit}</td>
                </tr>
              );
            })}
          </tbody>
        ))}
      </table>
    </div>
  );
}
