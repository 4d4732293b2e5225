import type { FitOutcome } from "@/lib/fits/record";
import type { FitSpec } from "@/lib/fits/spec";

/** Start → fitted value per parameter, with its standard error and whether it ended on a bound. */
export function ParameterResults({ outcome, spec, labels }: { outcome: FitOutcome; spec: FitSpec; labels: Record<string, string> }) {
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Fitted parameters</caption>
      <thead className="text-left text-xs text-ink-soft">
        <tr>
          <th className="py-1">Parameter</th>
          <th className="text-right">Start (eV)</th>
          <th className="text-right">Fitted (eV)</th>
          <th className="text-right">Δ (eV)</th>
          <th className="text-right">σ (eV)</th>
          <th className="pl-3">Bounds</th>
        </tr>
      </thead>
      <tbody>
        {outcome.names.map((name, i) => {
          const p = spec.parameters.find((q) => q.key === name);
          const v = outcome.values[i];
          const atBound = (p?.lower !== null && p?.lower === v) || (p?.upper !== null && p?.upper === v);
          const se = outcome.standardErrors?.[i];
          return (
            <tr key={name} className="border-t border-rule" data-testid="fit-parameter">
              <td className="py-1">
                {labels[name] ?? name} <span className="num block text-xs text-ink-soft">{name}</span>
              </td>
              <td className="num text-right">{outcome.start[i].toPrecision(6)}</td>
              <td className="num text-right font-semibold">{v.toPrecision(6)}</td>
              <td className="num text-right">{(v - outcome.start[i]).toFixed(6)}</td>
              <td className="num text-right">{se === undefined ? "—" : se.toPrecision(2)}</td>
              <td className="num pl-3 text-xs">
                [{p?.lower ?? "−∞"}, {p?.upper ?? "+∞"}]{atBound ? <strong className="ml-1 text-danger">on a bound</strong> : null}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
