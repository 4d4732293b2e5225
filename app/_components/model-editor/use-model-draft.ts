"use client";

import { useCallback, useId, useMemo, useState } from "react";
import { validateModelDocument, type DocumentIssue } from "@/lib/tb/document";
import type { CitationNeed } from "./citations-section";
import { isRecord, setAt, type Draft, type PathPart } from "./draft-path";
import type { EditorApi } from "./editor-context";
import { editorFields, fieldForIssue, sectionForIssue } from "./field-map";
import { plainIssueMessage } from "./issue-text";
import { changedParameterKeys, looseParameterValues } from "./parameter-keys";
import type { LocatedIssue } from "./problem-summary";

const CITATION_PREFIX = "provenance.citations.";

function toDraft(input: unknown): Draft {
  return isRecord(input) ? structuredClone(input) : {};
}

function collect(issues: DocumentIssue[], fields: string[], draft: Draft, idFor: (path: string) => string) {
  const byField = new Map<string, string[]>();
  const located: LocatedIssue[] = issues.map((issue) => {
    const field = fieldForIssue(issue.path, fields);
    const message = plainIssueMessage(issue, draft);
    if (field) byField.set(field, [...(byField.get(field) ?? []), message]);
    return { path: issue.path, message, target: idFor(field ?? `section:${sectionForIssue(issue.path)}`) };
  });
  return { byField, located };
}

/** The editor's state: the draft, its validation mapped onto fields, and the citations it still needs. */
export function useModelDraft(initialDocument: unknown, base: unknown | null, basisLimit?: number) {
  const [draft, setDraft] = useState<Draft>(() => toDraft(initialDocument));
  const prefix = useId();
  const idFor = useCallback((path: string) => `${prefix}-${path}`, [prefix]);
  const report = useMemo(() => validateModelDocument(draft, { maxBasis: basisLimit }), [draft, basisLimit]);

  const needs = useMemo<CitationNeed[]>(() => {
    const changed = new Set(changedParameterKeys(draft, base));
    const uncited = new Set(report.warnings.filter((w) => w.path.startsWith(CITATION_PREFIX)).map((w) => w.path.slice(CITATION_PREFIX.length)));
    return [...looseParameterValues(draft).keys()]
      .filter((key) => (changed.has(key) && !key.endsWith("/im")) || uncited.has(key))
      .map((key) => ({ key, why: changed.has(key) ? "changed" : "uncited" }));
  }, [draft, base, report]);

  const mapped = useMemo(() => {
    const fields = editorFields(draft, needs.map((n) => n.key));
    return { errors: collect(report.errors, fields, draft, idFor), warnings: collect(report.warnings, fields, draft, idFor) };
  }, [draft, needs, report, idFor]);

  const api = useMemo<EditorApi>(
    () => ({
      draft,
      base,
      idFor,
      errorsAt: (path) => mapped.errors.byField.get(path) ?? [],
      warningsAt: (path) => mapped.warnings.byField.get(path) ?? [],
      set: (path: readonly PathPart[], value: unknown) => setDraft((d) => setAt(d, path, value)),
      apply: (edit) => setDraft((d) => edit(d, base)),
    }),
    [draft, base, idFor, mapped],
  );

  return { draft, replace: (doc: Draft) => setDraft(toDraft(doc)), api, report, issues: mapped.errors.located, warningCount: report.warnings.length, needs };
}
