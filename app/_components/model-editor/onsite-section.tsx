"use client";

import { useEditor } from "./editor-context";
import { onsiteLayout } from "./field-map";
import { NumberInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

/** Species rows × orbital columns; a dash where a species carries no such orbital. */
export function OnsiteSection() {
  const { draft } = useEditor();
  const grid = onsiteLayout(draft);
  return (
    <SectionFrame id="onsite" title="On-site energies" unit="ε, eV">
      <div className="overflow-x-auto">
        <table className="text-sm">
          <thead>
            <tr className="text-xs text-ink-soft">
              <th scope="col" className="pr-2 text-left font-normal">
                species
              </th>
              {grid.orbitals.map((o) => (
                <th key={o} scope="col" className="num px-1 text-right font-normal">
                  {o}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {grid.species.map((s) => (
              <tr key={s} className="align-top">
                <th scope="row" className="pr-2 pt-1 text-left font-semibold">
                  {s}
                </th>
                {grid.orbitals.map((o) => (
                  <td key={o} className="w-[5.5rem] px-1 pb-1">
                    {grid.has(s, o) ? (
                      <NumberInput path={["onsite", s, o]} label={`on-site energy of ${s} ${o} (eV)`} />
                    ) : (
                      <span className="block pt-1 text-center text-ink-soft" aria-label={`${s} has no ${o} orbital`}>
                        —
                      </span>
                    )}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </SectionFrame>
  );
}
