"use client";

import { useDraggable } from "@dnd-kit/core";
import Link from "next/link";
import type { BoardCard } from "../card";
import type { MoveHint } from "../rules";
import { STAGE_META } from "../stages";
import { CardFacts } from "./card-facts";
import { MoveMenu } from "./move-menu";
import { ShiftSparkline } from "./sparkline";

export function ProposalCard({ card, hints, onMove, busy }: { card: BoardCard; hints: MoveHint[]; onMove: (card: BoardCard, hint: MoveHint) => void; busy: boolean }) {
  const { attributes, listeners, setNodeRef, transform, isDragging } = useDraggable({ id: card.id, data: { card } });
  const style = transform ? { transform: `translate3d(${transform.x}px, ${transform.y}px, 0)` } : undefined;
  return (
    <article
      ref={setNodeRef}
      style={style}
      aria-label={`${card.title}, ${STAGE_META[card.stage].label}`}
      data-testid={`card-${card.id}`}
      className={`rounded-lg border bg-card p-3 shadow-[0_1px_0_#d8cdb9] ${isDragging ? "z-10 border-copper opacity-90 shadow-lg" : "border-rule"} ${busy ? "opacity-60" : ""}`}
    >
      <div className="flex items-start gap-2">
        <button
          type="button"
          className="mt-0.5 cursor-grab rounded px-1 text-ink-soft hover:bg-paper-deep active:cursor-grabbing"
          aria-label={`Drag ${card.title}`}
          {...listeners}
          {...attributes}
          aria-roledescription="draggable proposal"
        >
          ⠿
        </button>
        <div className="min-w-0 flex-1">
          <div className="num text-[0.7rem] text-ink-soft">
            {card.familySlug} · {card.baseVersion ?? "new"} → r{card.revision}
          </div>
          <Link href={`/proposals/${card.id}`} className="block font-semibold leading-snug hover:text-copper-deep">
            {card.title}
          </Link>
          <div className="mt-1 text-xs text-ink-soft">
            by {card.authorName}
            {card.reviewers.length ? ` · reviewers: ${card.reviewers.map((r) => r.name).join(", ")}` : " · no reviewers yet"}
          </div>
          <div className="mt-2">
            <ShiftSparkline profile={card.shiftProfile} max={card.maxShift} />
          </div>
          <CardFacts card={card} />
        </div>
      </div>
      <MoveMenu card={card} hints={hints} onMove={onMove} disabled={busy} />
    </article>
  );
}
