"use client";

import { getAt } from "./draft-path";
import { asArray } from "./draft-read";
import { useEditor } from "./editor-context";
import { NumberInput, SelectInput, TextInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

const RANGES = [
  { path: ["validity", "strain"], label: "strain", unit: "fraction" },
  { path: ["validity", "temperature"], label: "temperature", unit: "K" },
  { path: ["validity", "energyWindow"], label: "energy window", unit: "eV" },
  { path: ["provenance", "fitWindow"], label: "fit window", unit: "eV" },
] as const;

/** Both bounds empty removes the optional range; one empty bound stays as text for the validator to name. */
function RangeRow({ path, label, unit }: { path: readonly string[]; label: string; unit: string }) {
  const api = useEditor();
  const setBound = (end: 0 | 1, value: unknown) => {
    const pair = [0, 1].map((j) => (j === end ? value : asArray(getAt(api.draft, path))[j]));
    const empty = pair.every((v) => v === undefined || v === "");
    api.set(path, empty ? undefined : pair.map((v) => v ?? ""));
  };
  return (
    <div className="grid grid-cols-[7rem_1fr_1fr_3.5rem] items-start gap-1.5">
      <span className="pt-1 text-xs font-semibold text-ink-soft">{label}</span>
      <NumberInput path={[...path, 0]} label={`${label}, lower bound (${unit})`} optional onValue={(v) => setBound(0, v)} />
      <NumberInput path={[...path, 1]} label={`${label}, upper bound (${unit})`} optional onValue={(v) => setBound(1, v)} />
      <span className="pt-1 text-xs text-ink-soft">{unit}</span>
    </div>
  );
}

/** Conventions, where the reference came from, and where the model may be trusted. */
export function ProvenanceSection() {
  return (
    <SectionFrame id="provenance" title="Conventions, provenance and validity">
      <div className="grid grid-cols-2 gap-x-3 gap-y-1.5">
        <TextInput path={["conventions", "energyZero"]} label="energy zero (what E = 0 means)" visibleLabel />
        <div className="grid grid-cols-2 gap-1.5">
          <div>
            <span className="mb-0.5 block text-xs font-semibold text-ink-soft">Bloch phase</span>
            <SelectInput path={["conventions", "blochPhase"]} label="Bloch phase convention" options={["atomic-position", "cell"]} />
          </div>
          <div>
            <span className="mb-0.5 block text-xs font-semibold text-ink-soft">spin layout</span>
            <SelectInput path={["conventions", "spinLayout"]} label="spin layout (follows spin–orbit)" options={["none", "up-block-then-down-block"]} />
          </div>
        </div>
        <TextInput path={["provenance", "referenceMethod"]} label="reference method" visibleLabel />
        <TextInput path={["provenance", "referenceCode"]} label="reference code and version" optional visibleLabel />
        <TextInput path={["provenance", "functional"]} label="functional" optional visibleLabel />
        <TextInput path={["provenance", "structureSource"]} label="structure source" visibleLabel />
        <TextInput path={["provenance", "kMesh"]} label="k-mesh" optional visibleLabel />
        <TextInput path={["provenance", "fitWeights"]} label="fit weights" optional visibleLabel />
      </div>
      <div className="mt-2 space-y-1">
        {RANGES.map((r) => (
          <RangeRow key={r.label} path={r.path} label={r.label} unit={r.unit} />
        ))}
      </div>
      <div className="mt-2 grid grid-cols-2 gap-x-3">
        <TextInput path={["provenance", "notes"]} label="provenance notes" optional multiline visibleLabel />
        <TextInput path={["validity", "notes"]} label="validity notes" optional multiline visibleLabel />
      </div>
    </SectionFrame>
  );
}
