"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, FormMessage, inputClass } from "@/app/_components/form-parts";
import { ApiError, fetchJson } from "@/lib/client-fetch";
import { REFERENCE_MAX_BYTES, REFERENCE_TOO_LARGE } from "@/lib/size-limits";

const FIELDS: { name: string; label: string; hint?: string }[] = [
  { name: "method", label: "Method", hint: "e.g. DFT-PBE, HSE06, ARPES" },
  { name: "functional", label: "Functional (if any)" },
  { name: "code", label: "Code and version" },
  { name: "structureSource", label: "Structure source", hint: "e.g. relaxed, a = 5.431 Å" },
  { name: "alignmentNote", label: "Energy zero / alignment (optional)" },
];

type Outcome = { ok: true } | { ok: false; error: string; fieldErrors: Record<string, string[]> };

/** Sends the file's text to the upload API; a file over the limit is refused here, before anything is sent. */
async function upload(proposalId: string, form: FormData): Promise<Outcome> {
  const file = form.get("file");
  if (!(file instanceof File) || file.size === 0) return { ok: false, error: "Choose a CSV or JSON file.", fieldErrors: { file: ["Choose a CSV or JSON file."] } };
  if (file.size > REFERENCE_MAX_BYTES) return { ok: false, error: REFERENCE_TOO_LARGE, fieldErrors: { file: [REFERENCE_TOO_LARGE] } };
  const provenance = Object.fromEntries(FIELDS.map((f) => [f.name, String(form.get(f.name) ?? "")]));
  try {
    await fetchJson(`/api/proposals/${proposalId}/reference-bands`, {
      method: "POST",
      body: { name: String(form.get("name") ?? ""), fileName: file.name, content: await file.text(), provenance },
    });
    return { ok: true };
  } catch (err) {
    if (err instanceof ApiError) return { ok: false, error: err.message, fieldErrors: err.fieldErrors ?? {} };
    return { ok: false, error: "The upload did not reach the server. Try again.", fieldErrors: {} };
  }
}

export function ReferenceUploadForm({ proposalId }: { proposalId: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const fieldErrors = outcome && !outcome.ok ? outcome.fieldErrors : {};

  const submit = async (event: React.FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    setPending(true);
    const result = await upload(proposalId, new FormData(form));
    setPending(false);
    setOutcome(result);
    if (result.ok) {
      form.reset();
      router.refresh();
    }
  };

  return (
    <form onSubmit={submit} className="rounded-lg border border-rule bg-card p-4" noValidate aria-label="Upload reference bands">
      {outcome && !outcome.ok ? <FormMessage kind="error">{outcome.error}</FormMessage> : null}
      {outcome?.ok ? <FormMessage kind="ok">Reference bands stored.</FormMessage> : null}
      <h3 className="mb-2 font-semibold">Attach reference bands</h3>
      <p className="mb-3 text-xs text-ink-soft">
        CSV with a header row (<code className="num">k_index</code>, <code className="num">k_path (1/angstrom)</code> or <code className="num">k1,k2,k3</code>,
        then <code className="num">E1 (eV)</code>, <code className="num">E2 (eV)</code>…) or the JSON format, at most 5 MiB; see docs/reference-bands.md. A
        file with any problem is not stored, and the message names its line and column.
      </p>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label="Name" name="ref-name" errors={fieldErrors.name}>
          <input id="ref-name" name="name" className={inputClass} />
        </Field>
        <Field label="File" name="ref-file" errors={fieldErrors.file ?? fieldErrors.content ?? fieldErrors.fileName}>
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
    </form>
  );
}
