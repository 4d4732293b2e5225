"use client";

import { useEditor } from "./editor-context";

export const smallButtonClass =
  "rounded border border-rule bg-card px-2 py-0.5 text-xs font-semibold text-ink hover:border-copper hover:text-copper-deep disabled:cursor-not-allowed disabled:opacity-50";

/** One titled group of the editor; its id is the target for issues that have no field of their own. */
export function SectionFrame({ id, title, unit, actions, children }: { id: string; title: string; unit?: string; actions?: React.ReactNode; children: React.ReactNode }) {
  const { idFor } = useEditor();
  return (
    <section id={idFor(`section:${id}`)} tabIndex={-1} aria-labelledby={idFor(`section:${id}:title`)} className="border-t border-rule pt-3 focus:outline-none">
      <div className="mb-2 flex items-baseline gap-2">
        <h3 id={idFor(`section:${id}:title`)} className="text-sm font-semibold uppercase tracking-wide text-ink">
          {title}
        </h3>
        {unit ? <span className="text-xs text-ink-soft">{unit}</span> : null}
        <div className="ml-auto flex gap-2">{actions}</div>
      </div>
      {children}
    </section>
  );
}
