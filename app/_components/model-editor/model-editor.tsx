"use client";

import { useEffect, useMemo, useRef } from "react";
import { validateModelDocument } from "@/lib/tb/document";
import { BondsSection } from "./bonds-section";
import { CellSection } from "./cell-section";
import { CitationsSection } from "./citations-section";
import { DocumentTransfer } from "./document-transfer";
import { asRecord, asText } from "./draft-read";
import { EditorContext } from "./editor-context";
import { TextInput } from "./field-inputs";
import { FillingSection } from "./filling-section";
import { HoppingsSection } from "./hoppings-section";
import { OnsiteSection } from "./onsite-section";
import { PreviewPanel } from "./preview-panel";
import { ProblemSummary } from "./problem-summary";
import { ProvenanceSection } from "./provenance-section";
import { SitesSection } from "./sites-section";
import { useBandPreview } from "./use-band-preview";
import { useModelDraft } from "./use-model-draft";

export interface ModelEditorProps {
  /** A model document; it may be invalid, in which case its problems are shown for the modeller to fix. */
  initialDocument: unknown;
  /** The release the proposal starts from (null for a blank model); drawn as the base series and used for Δ. */
  baseDocument: unknown | null;
  /** Name of the hidden input that always holds JSON.stringify of the current document. */
  inputName: string;
  onChange?: (doc: unknown, valid: boolean) => void;
  /** The instance's largest basis (states of H(k)); a larger model is shown as a problem and is not previewed. */
  basisLimit?: number;
}

/** Parameter editor of a model document with its bands, gap and checks computed live in a Web Worker. */
export function ModelEditor({ initialDocument, baseDocument, inputName, onChange, basisLimit }: ModelEditorProps) {
  const { draft, replace, api, report, issues, warningCount, needs } = useModelDraft(initialDocument, baseDocument, basisLimit);
  const validBase = useMemo(() => (baseDocument === null ? null : validateModelDocument(baseDocument).document), [baseDocument]);
  const preview = useBandPreview(report.document, validBase);
  const valid = report.document !== null;

  const onChangeRef = useRef(onChange);
  useEffect(() => {
    onChangeRef.current = onChange;
  }, [onChange]);
  useEffect(() => {
    onChangeRef.current?.(draft, valid);
  }, [draft, valid]);

  return (
    <EditorContext.Provider value={api}>
      <div className="grid items-start gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,31rem)]">
        <div className="min-w-0 space-y-3">
          <input type="hidden" name={inputName} value={JSON.stringify(draft)} />
          <section id={api.idFor("section:document")} tabIndex={-1} aria-label="Document" className="space-y-2 focus:outline-none">
            <div className="grid grid-cols-[minmax(0,1fr)_auto] items-end gap-3">
              <TextInput path={["name"]} label="Model name" visibleLabel />
              <DocumentTransfer draft={draft} onReplace={replace} basisLimit={basisLimit} />
            </div>
            <TextInput path={["description"]} label="Description" optional visibleLabel />
            {baseDocument === null ? (
              <p className="text-xs text-ink-soft">New model: no base release, so nothing is marked as changed.</p>
            ) : (
              <p className="text-xs text-ink-soft">
                <span aria-hidden className="mr-1 inline-block h-1.5 w-1.5 rounded-full bg-copper align-middle" />
                Δ marks a value that differs from the base release {asText(asRecord(baseDocument).name)}.
              </p>
            )}
            <ProblemSummary issues={issues} warningCount={warningCount} />
          </section>
          <SitesSection />
          <OnsiteSection />
          <BondsSection />
          <FillingSection />
          <HoppingsSection />
          <CellSection />
          <ProvenanceSection />
          <CitationsSection needs={needs} />
        </div>
        <aside className="min-w-0 lg:sticky lg:top-4">
          <PreviewPanel preview={preview} problems={issues.length} name={asText(draft.name)} hasBase={validBase !== null} />
        </aside>
      </div>
    </EditorContext.Provider>
  );
}
