"use client";

import { useState } from "react";
import { ORBITALS } from "@/lib/tb/orbitals";
import { pathText } from "./draft-path";
import { addSite, removeSite, setSiteSpecies, toggleOrbital } from "./draft-edits";
import { asText, readSites } from "./draft-read";
import { useEditor } from "./editor-context";
import { ChangeTag, FieldMessages, NumberInput, TextInput, cellInputClass } from "./field-inputs";
import { SectionFrame, smallButtonClass } from "./section-frame";

/** Species is committed on leaving the field: a rename rewires on-site energies, shells and citations at once. */
function SpeciesInput({ index, label }: { index: number; label: string }) {
  const api = useEditor();
  const path = ["sites", index, "species"] as const;
  const species = asText(readSites(api.draft)[index]?.species);
  const [text, setText] = useState(species);
  const [seen, setSeen] = useState(species);
  if (seen !== species) {
    setSeen(species);
    setText(species);
  }
  const commit = () => text !== species && api.apply((d, base) => setSiteSpecies(d, base, index, text.trim()));
  const key = pathText(path);
  return (
    <div>
      <input
        id={api.idFor(key)}
        type="text"
        aria-label={`species of site ${label}`}
        aria-invalid={api.errorsAt(key).length > 0}
        className={cellInputClass}
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => e.key === "Enter" && (e.preventDefault(), commit())}
      />
      <ChangeTag path={path} />
      <FieldMessages path={key} />
    </div>
  );
}

export function SitesSection() {
  const api = useEditor();
  const sites = readSites(api.draft);
  return (
    <SectionFrame
      id="sites"
      title="Sites"
      unit="Cartesian position, Å"
      actions={
        <button type="button" className={smallButtonClass} onClick={() => api.apply(addSite)}>
          + site
        </button>
      }
    >
      <ul className="space-y-2">
        {sites.map((site, i) => {
          const name = site.label || `#${i + 1}`;
          const orbitalsKey = pathText(["sites", i, "orbitals"]);
          return (
            <li key={i} className="rounded-md border border-rule bg-card px-2 py-1.5">
              <div className="grid grid-cols-[4.5rem_4.5rem_repeat(3,minmax(0,1fr))_auto] items-start gap-1.5">
                <TextInput path={["sites", i, "label"]} label={`label of site ${i + 1}`} />
                <SpeciesInput index={i} label={name} />
                {(["x", "y", "z"] as const).map((axis, j) => (
                  <NumberInput key={axis} path={["sites", i, "position", j]} label={`site ${name} position ${axis} (Å)`} />
                ))}
                <button
                  type="button"
                  className={smallButtonClass}
                  disabled={sites.length < 2}
                  aria-label={`remove site ${name}`}
                  onClick={() => api.apply((d, base) => removeSite(d, base, i))}
                >
                  remove
                </button>
              </div>
              <fieldset className="mt-1.5 flex flex-wrap items-center gap-x-2.5 gap-y-1 text-xs">
                <legend className="sr-only">Orbitals of site {name}</legend>
                <span aria-hidden className="text-ink-soft">orbitals</span>
                {ORBITALS.map((o, j) => {
                  const on = site.orbitals.includes(o);
                  return (
                    <label key={o} className="num flex items-center gap-1">
                      <input
                        id={j === 0 ? api.idFor(orbitalsKey) : undefined}
                        type="checkbox"
                        className="accent-copper"
                        checked={on}
                        disabled={on && site.orbitals.length === 1}
                        aria-label={`site ${name} orbital ${o}`}
                        onChange={(e) => api.apply((d, base) => toggleOrbital(d, base, i, o, e.target.checked))}
                      />
                      {o}
                    </label>
                  );
                })}
              </fieldset>
              <FieldMessages path={orbitalsKey} />
            </li>
          );
        })}
      </ul>
    </SectionFrame>
  );
}
