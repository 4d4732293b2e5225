import type { ModelView } from "@/lib/families/view";

/** Metrics, conventions and provenance of a released document, beside its bands. */
export function ModelFacts({ view }: { view: ModelView }) {
  const p = view.doc.provenance;
  const rows: [string, React.ReactNode][] = [
    ["Band gap on the path", <span key="gap" data-testid="release-gap">{view.gap.text}</span>],
    ...(view.fermiLevel !== null ? ([["Fermi level", `${view.fermiLevel.toFixed(3)} eV`]] as [string, string][]) : []),
    ["Basis size", `${view.basisSize} orbitals per cell`],
    ["Electrons per cell", String(view.doc.electronCount)],
    ["Energy zero", view.doc.conventions.energyZero],
    ["Validity range", view.validity],
    ["Reference", [p.referenceMethod, p.referenceCode, p.functional].filter(Boolean).join(" · ")],
    ["Structure", p.structureSource],
    ...(p.kMesh ? ([["k-mesh", p.kMesh]] as [string, string][]) : []),
    ...(p.fitWindow ? ([["Fit window", `${p.fitWindow[0]} to ${p.fitWindow[1]} eV${p.fitWeights ? ` (${p.fitWeights})` : ""}`]] as [string, string][]) : []),
    ["Parameter citations", `${Object.keys(p.citations).length} of ${view.parameters.length} parameters cite a source or reason`],
  ];
  return (
    <dl className="space-y-3 text-sm">
      {rows.map(([term, value]) => (
        <div key={term}>
          <dt className="text-ink-soft">{term}</dt>
          <dd className="num">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
