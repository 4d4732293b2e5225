import type { ParamDiffRow } from "@/lib/review/param-diff";
import { ENERGY_HEAT, formatEnergy, formatFixed, formatPercent, heatBackground, heatLevel, PERCENT_HEAT, type HeatScale } from "./diff-format";

const cell = "num whitespace-nowrap px-3 py-1.5 text-right align-top";

function Missing({ word }: { word: string }) {
  return <td className="whitespace-nowrap px-3 py-1.5 text-right align-top text-sm italic text-ink-soft">{word}</td>;
}

function HeatCell({ value, text, scale, title }: { value: number | null; text: string; scale: HeatScale; title?: string }) {
  return (
    <td className={cell} style={{ backgroundColor: heatBackground(heatLevel(value, scale)) }} title={title}>
      {text}
    </td>
  );
}

function EffectCell({ row }: { row: ParamDiffRow }) {
  if (row.effect === null) {
    return (
      <td className={`${cell} text-ink-soft`} title="Not estimated: the parameter is added or removed, which changes the structure">
        —<span className="sr-only"> not estimated (structural change)</span>
      </td>
    );
  }
  const approx = row.effectMethod === "first-order";
  return (
    <HeatCell
      value={row.effect}
      scale={ENERGY_HEAT}
      text={`${approx ? "≈" : ""}${formatEnergy(row.effect)}`}
      title={approx ? "first-order estimate (Hellmann–Feynman)" : "exact recompute with this parameter changed alone"}
    />
  );
}

/** One changed parameter: values, Δ, %Δ and its effect, with a link that anchors a remark to it (for those who may write one). */
export function ParamDiffRowView({ row, remarkHref }: { row: ParamDiffRow; remarkHref: string | null }) {
  return (
    <tr id={`param-${row.key}`} className="scroll-mt-20 target:outline target:outline-2 target:outline-copper">
      <td className="px-3 py-1.5 align-top">
        <span className="font-medium">{row.label}</span>
        {row.signFlip ? (
          <span className="ml-2 whitespace-nowrap rounded border border-copper px-1 text-xs font-semibold text-copper-deep">
            <span aria-hidden="true">⇅ </span>sign flip
          </span>
        ) : null}
        <div className="flex flex-wrap items-baseline gap-x-3 text-xs text-ink-soft">
          <span className="num break-all">{row.key}</span>
          {remarkHref ? (
            <a href={remarkHref} className="text-copper-deep underline">
              Remark on this
            </a>
          ) : null}
        </div>
      </td>
      {row.base === null ? <Missing word="added" /> : <td className={cell}>{formatFixed(row.base, 4)}</td>}
      {row.proposed === null ? <Missing word="removed" /> : <td className={cell}>{formatFixed(row.proposed, 4)}</td>}
      {row.delta === null ? <td className={`${cell} text-ink-soft`}>—</td> : <HeatCell value={row.delta} scale={ENERGY_HEAT} text={formatFixed(row.delta, 4, true)} />}
      {row.percent === null ? (
        <td className={`${cell} text-ink-soft`} title={row.base === 0 ? "base value is zero" : undefined}>
          —
        </td>
      ) : (
        <HeatCell value={row.percent} scale={PERCENT_HEAT} text={formatPercent(row.percent)} />
      )}
      <EffectCell row={row} />
    </tr>
  );
}

export function HeatLegend() {
  const swatches = (
    <span aria-hidden="true" className="inline-flex">
      {[0.05, 0.25, 0.5, 0.75, 1].map((s) => (
        <span key={s} className="inline-block h-3 w-4 border border-rule" style={{ backgroundColor: heatBackground(s) }} />
      ))}
    </span>
  );
  return (
    <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-ink-soft">
      <span>Shading by magnitude, log scale:</span>
      <span className="num">|Δ|, |ΔE| 1 meV</span>
      {swatches}
      <span className="num">1 eV;</span>
      <span className="num">|%Δ| 0.1 %</span>
      {swatches}
      <span className="num">100 %</span>
    </p>
  );
}
