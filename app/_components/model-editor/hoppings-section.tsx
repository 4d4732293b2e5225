"use client";

import { asArray, asRecord, asText } from "./draft-read";
import { useEditor } from "./editor-context";
import { NumberInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

function endText(end: unknown): string {
  const e = asRecord(end);
  return `${asText(e.site)}:${asText(e.orbital)}`;
}

/** Explicit hoppings come from uploaded documents; their values are editable here, their pairs only by upload. */
export function HoppingsSection() {
  const { draft } = useEditor();
  const hoppings = asArray(draft.hoppings);
  if (!hoppings.length) return null;
  return (
    <SectionFrame id="hoppings" title="Explicit hoppings" unit="eV">
      <ul className="space-y-1 text-sm">
        {hoppings.map((raw, i) => {
          const h = asRecord(raw);
          const what = `${endText(h.from)} → ${endText(h.to)} [${asArray(h.translation).join(", ")}]`;
          return (
            <li key={i} className="grid grid-cols-[minmax(0,1fr)_6rem_6rem] items-start gap-2">
              <span className="num truncate pt-1 text-xs">{what}</span>
              <NumberInput path={["hoppings", i, "value", "re"]} label={`real part of hopping ${what} (eV)`} />
              <NumberInput path={["hoppings", i, "value", "im"]} label={`imaginary part of hopping ${what} (eV)`} optional />
            </li>
          );
        })}
      </ul>
    </SectionFrame>
  );
}
