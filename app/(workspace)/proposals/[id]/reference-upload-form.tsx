"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass } from "@/app/_components/form-parts";
import { uploadReferenceAction } from "../actions";

const FIELDS: { name: string; label: string; hint?: string }[] = [
  { name: "method", label: "Method", hint: "e.g. DFT-PBE, HSE06, ARPES" },
  { name: "functional", label: "Functional (if any)" },
  { name: "code", label: "Code and version" },
  { name: "structureSource", label: "Structure source", hint: "e.g. relaxed, a = 5.431 Å" },
  { name: "alignmentNote", label: "Energy zero / alignment (optional)" },
];

export function ReferenceUploadForm({ proposalId }: { proposalId: string }) {
  return (
    <ActionForm action={uploadReferenceAction} label="Upload reference bands" className="rounded-lg border border-rule bg-card p-4">
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <h3 className="mb-2 font-semibold">Attach reference bands</h3>
          <p className="mb-3 text-xs text-ink-soft">
            CSV with a header row (<code className="num">k_index</code>, <code className="num">k_path (1/angstrom)</code> or <code className="num">k1,k2,k3</code>,
            then <code className="num">E1 (eV)</code>, <code className="num">E2 (eV)</code>…) or the JSON format; see docs/reference-bands.md. A file with any
            problem is not stored, and the message names its line and column.
          </p>
          <div className="grid gap-x-4 sm:grid-cols-2">
            <Field label="Name" name="ref-name" errors={fieldErrors.name}>
              <input id="ref-name" name="name" className={inputClass} />
            </Field>
            <Field label="File" name="ref-file" errors={fieldErrors.file}>
              <input id="ref-file" name="file" type="file" accept=".csv,.json,text/csv,application/json" className="text-sm" />
            </Field>
            {FIELDS.map((f) => (
              <Field key={f.name} label={f.label} name={`ref-${f.name}`} errors={fieldErrors[f.name]} hint={f.hint}>
                <input id={`ref-${f.name}`} name={f.name} className={inputClass} />
              </Field>
            ))}
          </div>
          <button type="submit" disabled={pending} className="rounded-md border border-copper px-3 py-1.5 text-sm font-semibold text-copper-deep">
            {pending ? "Checking…" : "Upload"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
