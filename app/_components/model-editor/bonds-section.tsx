"use client";

import { addShell, removeShell, setShellIndex, setShellSpecies } from "./draft-edits";
import { readShells, siteSpecies } from "./draft-read";
import { useEditor } from "./editor-context";
import { shellParamKeys } from "./field-map";
import { NumberInput, SelectInput } from "./field-inputs";
import { SectionFrame, smallButtonClass } from "./section-frame";

const SYMBOL: Record<string, string> = { sigma: "σ", pi: "π", delta: "δ" };

/** "sp_sigma" → "spσ": the usual written form, with the key itself kept for screen readers and the document. */
function keyText(key: string): string {
  const [pair, m] = key.split("_");
  return `${pair}${SYMBOL[m] ?? `_${m ?? ""}`}`;
}

export function BondsSection() {
  const api = useEditor();
  const shells = readShells(api.draft);
  const species = siteSpecies(api.draft);
  return (
    <SectionFrame
      id="bonds"
      title="Bond parameters"
      unit="two-centre integrals, eV"
      actions={
        <button type="button" className={smallButtonClass} onClick={() => api.apply(addShell)}>
          + shell
        </button>
      }
    >
      {shells.length === 0 ? <p className="text-sm text-ink-soft">No neighbour shells: the bands are flat on-site levels.</p> : null}
      <ul className="space-y-2">
        {shells.map((shell, i) => {
          const name = `${shell.species.join("–")} shell ${shell.index ?? "?"}`;
          return (
            <li key={i} className="rounded-md border border-rule bg-card px-2 py-1.5">
              <div aria-hidden className="mb-0.5 grid grid-cols-[4.5rem_4.5rem_3.5rem_minmax(0,1fr)_minmax(0,1fr)_4rem] gap-1.5 text-[11px] text-ink-soft">
                <span>from</span>
                <span>to</span>
                <span>index</span>
                <span>distance Å</span>
                <span>tolerance Å</span>
                <span />
              </div>
              <div className="grid grid-cols-[4.5rem_4.5rem_3.5rem_minmax(0,1fr)_minmax(0,1fr)_4rem] items-start gap-1.5 text-xs">
                {([0, 1] as const).map((end) => (
                  <SelectInput
                    key={end}
                    path={["shells", i, "species", end]}
                    label={`${end === 0 ? "from" : "to"} species of shell ${i + 1}`}
                    options={species}
                    onValue={(value) => api.apply((d, base) => setShellSpecies(d, base, i, end, value))}
                  />
                ))}
                <NumberInput path={["shells", i, "index"]} label={`neighbour index of shell ${i + 1}`} onValue={(v) => api.apply((d) => setShellIndex(d, i, v))} />
                <NumberInput path={["shells", i, "distance"]} label={`distance of ${name} (Å)`} />
                <NumberInput path={["shells", i, "tolerance"]} label={`distance tolerance of ${name} (Å)`} optional />
                <button type="button" className={smallButtonClass} aria-label={`remove ${name}`} onClick={() => api.apply((d, base) => removeShell(d, base, i))}>
                  remove
                </button>
              </div>
              <div className="mt-1.5 grid grid-cols-[repeat(auto-fill,minmax(5.25rem,1fr))] gap-x-1.5 gap-y-1">
                {shellParamKeys(api.draft, i).map((key) => (
                  <div key={key}>
                    <span aria-hidden className="num block text-[11px] text-ink-soft">
                      {keyText(key)}
                    </span>
                    <NumberInput path={["shells", i, "params", key]} label={`${key} of ${name} (eV)`} />
                  </div>
                ))}
              </div>
            </li>
          );
        })}
      </ul>
    </SectionFrame>
  );
}
