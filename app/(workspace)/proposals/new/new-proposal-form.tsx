"use client";

import { useState } from "react";
import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { createProposalAction } from "../actions";

export interface FamilyChoice {
  slug: string;
  title: string;
  releases: { id: string; version: string }[];
}

export function NewProposalForm({ families, initialFamily }: { families: FamilyChoice[]; initialFamily: string | null }) {
  const [slug, setSlug] = useState(initialFamily ?? families[0]?.slug ?? "");
  const family = families.find((f) => f.slug === slug);
  return (
    <ActionForm action={createProposalAction} label="Start a proposal" className="max-w-2xl rounded-xl border border-rule bg-card p-6">
      {({ fieldErrors, pending }) => (
        <>
          <Field label="Model family" name="familySlug" errors={fieldErrors.familySlug}>
            <select id="familySlug" name="familySlug" value={slug} onChange={(e) => setSlug(e.target.value)} className={inputClass}>
              {families.map((f) => (
                <option key={f.slug} value={f.slug}>
                  {f.title}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Start from" name="baseReleaseId" errors={fieldErrors.baseReleaseId} hint="The release your change is measured against; its parameters fill the editor.">
            <select id="baseReleaseId" name="baseReleaseId" key={slug} className={inputClass}>
              {family?.releases.map((r, i) => (
                <option key={r.id} value={r.id}>
                  release {r.version}
                  {i === 0 ? " (latest)" : ""}
                </option>
              ))}
              <option value="blank">a blank model (no base release)</option>
            </select>
          </Field>
          <Field label="Title" name="title" errors={fieldErrors.title}>
            <input id="title" name="title" className={inputClass} placeholder="e.g. Refit the s–p coupling to new reference bands" />
          </Field>
          <Field label="Rationale (markdown, $math$)" name="rationale" errors={fieldErrors.rationale} hint="Why this change, and what it should do to the bands.">
            <textarea id="rationale" name="rationale" rows={5} className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Creating…" : "Create draft"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
