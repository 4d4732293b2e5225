import { NumberCell } from "@/app/_components/number-cell";
import type { ParameterChange } from "@/board/submission";

/** The changed parameters against the base release, largest relative change first. */
export function ParameterChanges({ changes }: { changes: ParameterChange[] }) {
  if (changes.length === 0) return <p className="text-sm text-ink-soft">No parameter differs from the base release.</p>;
  const rel = (c: ParameterChange) => (c.base && c.proposed !== null ? Math.abs((c.proposed - c.base) / c.base) : Infinity);
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-card">
      <table className="w-full text-sm">
        <caption className="sr-only">Parameters that differ from the base release</caption>
        <thead className="bg-paper-deep text-left">
          <tr>
            <th className="px-3 py-1.5">Parameter</th>
            <th className="px-3 py-1.5 text-right">Base (eV)</th>
            <th className="px-3 py-1.5 text-right">Proposed (eV)</th>
            <th className="px-3 py-1.5 text-right">Δ (eV)</th>
            <th className="px-3 py-1.5 text-right">%Δ</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {[...changes].sort((a, b) => rel(b) - rel(a)).map((c) => (
            <tr key={c.key}>
              <td className="px-3 py-1.5">
                {c.label}
                <div className="num text-xs text-ink-soft">{c.key}</div>
              </td>
              {c.base === null ? <td className="px-3 py-1.5 text-right text-ink-soft">added</td> : <NumberCell value={c.base} />}
              {c.proposed === null ? <td className="px-3 py-1.5 text-right text-ink-soft">removed</td> : <NumberCell value={c.proposed} />}
              {c.base !== null && c.proposed !== null ? <NumberCell value={c.proposed - c.base} /> : <td />}
              {c.base && c.proposed !== null ? <NumberCell value={(100 * (c.proposed - c.base)) / Math.abs(c.base)} digits={1} /> : <td />}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
