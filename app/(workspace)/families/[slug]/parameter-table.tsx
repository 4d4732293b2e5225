import { NumberCell } from "@/app/_components/number-cell";
import type { ParameterRef } from "@/lib/tb/parameters";

const KIND_TITLE: Record<ParameterRef["kind"], string> = {
  onsite: "On-site energies",
  bond: "Two-centre (Slater–Koster) integrals",
  soc: "Spin–orbit strengths",
  hopping: "Explicit hoppings",
};

export function ParameterTable({ parameters, citations }: { parameters: ParameterRef[]; citations: Record<string, string> }) {
  const kinds = (Object.keys(KIND_TITLE) as ParameterRef["kind"][]).filter((k) => parameters.some((p) => p.kind === k));
  return (
    <div className="space-y-6">
      {kinds.map((kind) => (
        <section key={kind} aria-labelledby={`params-${kind}`}>
          <h3 id={`params-${kind}`} className="mb-2 font-semibold">
            {KIND_TITLE[kind]}
          </h3>
          <div className="overflow-x-auto rounded-lg border border-rule bg-card">
            <table className="w-full text-sm">
              <thead className="bg-paper-deep text-left">
                <tr>
                  <th className="px-3 py-1.5">Parameter</th>
                  <th className="px-3 py-1.5 text-right">Value (eV)</th>
                  <th className="px-3 py-1.5">Citation or reason</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {parameters
                  .filter((p) => p.kind === kind)
                  .map((p) => (
                    <tr key={p.key}>
                      <td className="px-3 py-1.5">
                        <div>{p.label}</div>
                        <div className="num text-xs text-ink-soft">{p.key}</div>
                      </td>
                      <NumberCell value={p.value} />
                      <td className="px-3 py-1.5 text-ink-soft">{citations[p.key] ?? <em>none given</em>}</td>
                    </tr>
                  ))}
              </tbody>
            </table>
          </div>
        </section>
      ))}
    </div>
  );
}
