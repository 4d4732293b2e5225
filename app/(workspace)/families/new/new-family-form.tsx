"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { createFamilyAction } from "../actions";

export function NewFamilyForm() {
  return (
    <ActionForm action={createFamilyAction} label="Open a model family" className="max-w-2xl rounded-xl border border-rule bg-card p-6">
      {({ fieldErrors, pending }) => (
        <>
          <div className="grid gap-x-4 sm:grid-cols-2">
            <Field label="Slug" name="slug" errors={fieldErrors.slug} hint="How codes name it, e.g. zincblende-sp3s">
              <input id="slug" name="slug" className={inputClass} />
            </Field>
            <Field label="Title" name="title" errors={fieldErrors.title}>
              <input id="title" name="title" className={inputClass} />
            </Field>
            <Field label="Dimension" name="dimension" errors={fieldErrors.dimension}>
              <select id="dimension" name="dimension" className={inputClass} defaultValue="3">
                <option value="1">1 (chain)</option>
                <option value="2">2 (sheet)</option>
                <option value="3">3 (crystal)</option>
              </select>
            </Field>
            <Field label="Accepting reviewers needed" name="requiredAccepts" errors={fieldErrors.requiredAccepts}>
              <input id="requiredAccepts" name="requiredAccepts" type="number" min={1} max={10} defaultValue={2} className={inputClass} />
            </Field>
          </div>
          <Field label="Description" name="description" errors={fieldErrors.description}>
            <textarea id="description" name="description" rows={3} className={inputClass} />
          </Field>
          <Field
            label="Acceptance criteria (JSON)"
            name="acceptanceCriteria"
            errors={fieldErrors.acceptanceCriteria}
            hint='Checked on every revision, e.g. [{"metric": "gap", "target": 1.17, "tolerance": 0.05}, {"metric": "gap-character", "direct": false}]'
          >
            <textarea id="acceptanceCriteria" name="acceptanceCriteria" rows={4} defaultValue="[]" className={`${inputClass} num text-sm`} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            Open family
          </button>
        </>
      )}
    </ActionForm>
  );
}
