/** Parameter correlations: strong ones (|r| near 1) mean the reference barely tells those parameters apart. */
export function CorrelationMatrix({ names, correlations, labels }: { names: string[]; correlations: number[][]; labels: Record<string, string> }) {
  return (
    <div className="overflow-auto">
      <table className="text-xs">
        <caption className="sr-only">Correlation coefficients between fitted parameters</caption>
        <thead>
          <tr>
            <th />
            {names.map((n, j) => (
              <th key={n} className="num px-1 font-normal text-ink-soft" title={labels[n] ?? n}>
                {j + 1}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {correlations.map((row, i) => (
            <tr key={names[i]}>
              <th className="pr-2 text-left font-normal text-ink-soft" title={names[i]}>
                <span className="num">{i + 1}</span> {labels[names[i]] ?? names[i]}
              </th>
              {row.map((r, j) => (
                <td
                  key={j}
                  className="num px-1.5 py-1 text-right"
                  style={{ background: i === j ? "var(--color-paper-deep)" : `rgba(132, 65, 28, ${(0.75 * Math.abs(r)).toFixed(2)})`, color: Math.abs(r) > 0.6 && i !== j ? "white" : undefined }}
                >
                  {r.toFixed(2)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-soft">|r| above about 0.95 means the reference bands cannot separate the two parameters well (common practice); consider fixing one.</p>
    </div>
  );
}
