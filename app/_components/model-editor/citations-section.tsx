"use client";

import { getAt } from "./draft-path";
import { useEditor } from "./editor-context";
import { TextInput } from "./field-inputs";
import { SectionFrame } from "./section-frame";

export interface CitationNeed {
  key: string;
  /** changed: differs from the base (or the base lacks it); uncited: unchanged but without citation or reason. */
  why: "changed" | "uncited";
}

/** A citation or a reason for every parameter that moved, and for any still without one. */
export function CitationsSection({ needs }: { needs: CitationNeed[] }) {
  const { draft, base } = useEditor();
  return (
    <SectionFrame id="citations" title="Citations and reasons" unit={`${needs.length} parameter${needs.length === 1 ? "" : "s"}`}>
      {needs.length === 0 ? <p className="text-sm text-ink-soft">Every parameter matches the base and carries its citation.</p> : null}
      <ul className="space-y-1.5">
        {needs.map(({ key, why }) => {
          const path = ["provenance", "citations", key];
          const inherited = why === "changed" && base !== null && getAt(draft, path) !== undefined && getAt(draft, path) === getAt(base, path);
          return (
            <li key={key} className="grid grid-cols-[11rem_minmax(0,1fr)] items-start gap-2">
              <span className="pt-1 text-xs">
                <span className="num block truncate" title={key}>
                  {key}
                </span>
                <span className="text-ink-soft">
                  {why === "changed" ? "◆ changed" : "○ no citation"}
                  {inherited ? " · text is the base's" : ""}
                </span>
              </span>
              <TextInput path={path} label={`citation or reason for ${key}`} optional hideChange />
            </li>
          );
        })}
      </ul>
    </SectionFrame>
  );
}
