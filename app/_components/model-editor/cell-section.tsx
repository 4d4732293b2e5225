"use client";

import { STANDARD_PATHS } from "@/lib/tb/kpath-standard";
import { asArray, asRecord } from "./draft-read";
import { useEditor } from "./editor-context";
import { NumberInput, SelectInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

const AXES = ["x", "y", "z"] as const;

/** Primitive vectors and the default k-path the preview follows. */
export function CellSection() {
  const { draft } = useEditor();
  const lattice = asRecord(draft.lattice);
  const dimension = typeof lattice.dimension === "number" ? lattice.dimension : null;
  const kPath = asRecord(draft.kPath);
  const paths = Object.entries(STANDARD_PATHS).filter(([, p]) => p.dimension === dimension).map(([name]) => name);
  return (
    <SectionFrame id="cell" title="Cell and k-path" unit={`${dimension ?? "?"}-dimensional · Å`}>
      <table className="w-full text-sm">
        <thead>
          <tr className="text-xs text-ink-soft">
            <th scope="col" className="w-12 text-left font-normal">
              vector
            </th>
            {AXES.map((a) => (
              <th key={a} scope="col" className="px-1 text-right font-normal">
                {a}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {asArray(lattice.vectors).map((_, i) => (
            <tr key={i} className="align-top">
              <th scope="row" className="num pt-1 text-left font-normal">
                a{i + 1}
              </th>
              {AXES.map((a, j) => (
                <td key={a} className="px-1 pb-1">
                  <NumberInput path={["lattice", "vectors", i, j]} label={`lattice vector a${i + 1}, ${a} (Å)`} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-2 grid grid-cols-[1fr_8rem] items-start gap-3 text-sm">
        {kPath.type === "custom" ? (
          <p className="text-ink-soft">Custom k-path from the document ({asArray(kPath.segments).length} runs); upload a document to change it.</p>
        ) : (
          <label className="flex items-start gap-2">
            <span className="pt-1 text-xs text-ink-soft">standard path</span>
            <SelectInput path={["kPath", "lattice"]} label="standard k-path lattice" options={paths} className="flex-1" />
          </label>
        )}
        <label className="flex items-start gap-2">
          <span className="pt-1 text-xs text-ink-soft">points</span>
          <NumberInput path={["kPath", "pointsTotal"]} label="k-points on the path" optional className="flex-1" />
        </label>
      </div>
    </SectionFrame>
  );
}
