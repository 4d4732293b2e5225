"use client";

import { pathText } from "./draft-path";
import { setSpinOrbit } from "./draft-edits";
import { asRecord } from "./draft-read";
import { useEditor } from "./editor-context";
import { spinOrbitSpecies } from "./field-map";
import { FieldMessages, NumberInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

/** Spin–orbit λ per species with p orbitals (switching it on doubles the basis) and the electron count. */
export function FillingSection() {
  const api = useEditor();
  const species = spinOrbitSpecies(api.draft);
  const spinOrbit = asRecord(api.draft.spinOrbit);
  return (
    <SectionFrame id="filling" title="Spin–orbit and filling">
      <div className="flex flex-wrap items-start gap-x-6 gap-y-2 text-sm">
        {species.length === 0 ? <p className="text-xs text-ink-soft">Spin–orbit λ needs a species with p orbitals.</p> : null}
        {species.map((s) => {
          const on = s in spinOrbit;
          const key = pathText(["spinOrbit", s]);
          return (
            <div key={s} className="flex items-start gap-2">
              <label className="flex items-center gap-1 pt-1">
                <input
                  id={on ? undefined : api.idFor(key)}
                  type="checkbox"
                  className="accent-copper"
                  checked={on}
                  onChange={(e) => api.apply((d, base) => setSpinOrbit(d, base, s, e.target.checked))}
                />
                λ({s})
              </label>
              {on ? <NumberInput path={["spinOrbit", s]} label={`spin–orbit λ of ${s} (eV)`} className="w-24" /> : <FieldMessages path={key} />}
              {on ? <span className="pt-1 text-xs text-ink-soft">eV</span> : null}
            </div>
          );
        })}
        <div className="ml-auto flex items-start gap-2">
          <label htmlFor={api.idFor("electronCount")} className="pt-1 text-xs text-ink-soft">
            electrons per cell
          </label>
          <NumberInput path={["electronCount"]} label="electrons per cell" className="w-20" />
        </div>
      </div>
    </SectionFrame>
  );
}
