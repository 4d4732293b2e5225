"use client";

import { useDroppable } from "@dnd-kit/core";
import type { Stage } from "../stages";
import { STAGE_META } from "../stages";

export type LaneState = "idle" | "origin" | "allowed" | "blocked" | "refused";

const STATE_CLASS: Record<LaneState, string> = {
  idle: "border-rule",
  origin: "border-rule",
  allowed: "border-copper bg-copper-pale/40",
  blocked: "border-dashed border-copper/60",
  refused: "border-rule opacity-50 [background-image:repeating-linear-gradient(135deg,transparent_0_8px,#d8cdb933_8px_10px)]",
};

const STATE_WORD: Record<LaneState, string> = {
  idle: "",
  origin: "from here",
  allowed: "drop here",
  blocked: "gate not met",
  refused: "not allowed",
};

export function Lane({ stage, count, state, children }: { stage: Stage; count: number; state: LaneState; children: React.ReactNode }) {
  const { setNodeRef, isOver } = useDroppable({ id: stage, data: { stage } });
  const meta = STAGE_META[stage];
  return (
    <section
      ref={setNodeRef}
      aria-label={`${meta.label} lane, ${count} proposals`}
      data-testid={`lane-${stage}`}
      data-lane-state={state}
      className={`flex min-h-40 w-64 shrink-0 flex-col rounded-xl border-2 bg-paper-deep/50 p-2 transition-colors ${STATE_CLASS[state]} ${isOver && state === "allowed" ? "ring-2 ring-copper" : ""}`}
    >
      <header className="mb-2 flex items-baseline gap-2 px-1">
        <span aria-hidden className="text-lg leading-none text-copper-deep">
          {meta.glyph}
        </span>
        <h2 className="font-semibold">{meta.label}</h2>
        <span className="num text-xs text-ink-soft">{count}</span>
        {STATE_WORD[state] ? <span className="ml-auto text-xs font-semibold text-ink-soft">{STATE_WORD[state]}</span> : null}
      </header>
      <p className="mb-2 px-1 text-xs text-ink-soft">{meta.hint}</p>
      <div className="flex flex-col gap-2">{children}</div>
    </section>
  );
}
