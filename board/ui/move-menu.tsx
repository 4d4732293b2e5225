"use client";

import { useId } from "react";
import type { BoardCard } from "../card";
import type { MoveHint } from "../rules";
import { STAGE_META } from "../stages";

/** The non-drag way to move a card: every move this person could make, with what still blocks it. */
export function MoveMenu({ card, hints, onMove, disabled }: { card: BoardCard; hints: MoveHint[]; onMove: (card: BoardCard, hint: MoveHint) => void; disabled: boolean }) {
  const id = useId();
  if (hints.length === 0) return null;
  return (
    <div className="mt-2 border-t border-rule pt-2">
      <label htmlFor={id} className="sr-only">
        Move {card.title} to…
      </label>
      <select
        id={id}
        disabled={disabled}
        value=""
        onChange={(e) => {
          const hint = hints.find((h) => h.to === e.target.value);
          if (hint) onMove(card, hint);
        }}
        className="w-full rounded border border-rule bg-white px-2 py-1 text-sm"
      >
        <option value="">Move to…</option>
        {hints.map((h) => (
          <option key={h.to} value={h.to}>
            {STAGE_META[h.to].glyph} {STAGE_META[h.to].label}
            {h.allowed ? (h.needsReason ? " (give a reason)" : "") : ` — blocked: ${h.reasons[0]}`}
          </option>
        ))}
      </select>
    </div>
  );
}
