"use client";

import { DndContext, KeyboardSensor, PointerSensor, useSensor, useSensors, type Announcements, type DragEndEvent, type DragStartEvent } from "@dnd-kit/core";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { fetchJson } from "@/lib/client-fetch";
import type { BoardCard } from "../card";
import type { MoveHint, RuleActor } from "../rules";
import type { BoardFilters } from "../schemas";
import { ARCHIVE_STAGES, LANE_STAGES, STAGE_META, type Stage } from "../stages";
import { BoardFilterBar, filtersToQuery } from "./board-filters";
import { useHydrated } from "./use-hydrated";
import { hintsForCard } from "./card-hints";
import { Lane, type LaneState } from "./lane";
import { laneCollision, laneCoordinates } from "./lane-keyboard";
import { ProposalCard } from "./proposal-card";
import { ReasonDialog } from "./reason-dialog";
import { useCardMoves, type BoardData } from "./use-card-moves";

const stageOf = (id: string | number | undefined | null): Stage | null => (id ? (String(id) as Stage) : null);

export function BoardView({ initial, viewer, filters }: { initial: BoardData; viewer: RuleActor; filters: BoardFilters }) {
  const query = filtersToQuery(filters);
  const { data, mutate } = useSWR<BoardData>(`/api/board${query ? `?${query}` : ""}`, (url: string) => fetchJson<BoardData>(url), {
    fallbackData: initial,
    refreshInterval: 15_000,
  });
  const board = data ?? initial;
  const { move, busy, notice } = useCardMoves(mutate);
  const [active, setActive] = useState<BoardCard | null>(null);
  const [pending, setPending] = useState<{ card: BoardCard; to: Stage } | null>(null);
  // Lets tests (and impatient people) know the board is interactive, not just server-rendered.
  const ready = useHydrated();
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 5 } }), useSensor(KeyboardSensor, { coordinateGetter: laneCoordinates }));

  const curators = useMemo(() => Object.fromEntries(board.families.map((f) => [f.slug, f.curatorIds])), [board.families]);
  const hintsOf = (card: BoardCard): MoveHint[] => hintsForCard(viewer, card, curators);
  const cardById = (id: string | number) => board.cards.find((c) => c.id === id) ?? null;
  const activeHints = active ? hintsOf(active) : [];

  function laneState(stage: Stage): LaneState {
    if (!active) return "idle";
    if (stage === active.stage) return "origin";
    const hint = activeHints.find((h) => h.to === stage);
    return hint ? (hint.allowed ? "allowed" : "blocked") : "refused";
  }

  function request(card: BoardCard, to: Stage) {
    if (to === card.stage) return;
    const hint = hintsOf(card).find((h) => h.to === to);
    if (hint?.allowed && hint.needsReason) setPending({ card, to });
    else void move(card, to);
  }

  function onDragEnd(e: DragEndEvent) {
    setActive(null);
    const card = cardById(e.active.id);
    const to = stageOf(e.over?.id);
    if (card && to) request(card, to);
  }

  const announcements: Announcements = {
    onDragStart: ({ active: a }) => {
      const card = cardById(a.id);
      if (!card) return "";
      const open = hintsOf(card).filter((h) => h.allowed).map((h) => STAGE_META[h.to].label);
      return `Picked up ${card.title} from ${STAGE_META[card.stage].label}. ${open.length ? `It may go to ${open.join(", ")}.` : "You cannot move it anywhere now."} Use left and right arrows to change lane, space to drop, escape to cancel.`;
    },
    onDragOver: ({ over }) => (over ? `Over the ${STAGE_META[stageOf(over.id)!].label} lane.` : "Not over a lane."),
    onDragEnd: ({ active: a, over }) => `Dropped ${cardById(a.id)?.title ?? "the card"}${over ? ` on ${STAGE_META[stageOf(over.id)!].label}` : ""}; asking the server.`,
    onDragCancel: ({ active: a }) => `Cancelled; ${cardById(a.id)?.title ?? "the card"} stays where it was.`,
  };

  const authors = useMemo(() => [...new Map(board.cards.map((c) => [c.authorId, { id: c.authorId, name: c.authorName }])).values()], [board.cards]);
  const renderLane = (stage: Stage) => {
    const cards = board.cards.filter((c) => c.stage === stage);
    return (
      <Lane key={stage} stage={stage} count={cards.length} state={laneState(stage)}>
        {cards.map((card) => (
          <ProposalCard key={card.id} card={card} hints={hintsOf(card)} busy={busy === card.id} onMove={(c, h) => request(c, h.to)} />
        ))}
      </Lane>
    );
  };

  return (
    <div data-board-ready={ready}>
      <BoardFilterBar filters={filters} families={board.families} authors={authors} />
      <div role="status" aria-live="polite" className="min-h-8">
        {notice ? (
          <p
            data-testid="board-notice"
            className={`mb-3 rounded-md px-3 py-2 text-sm ${notice.kind === "ok" ? "bg-ok-pale text-ok" : notice.kind === "conflict" ? "bg-copper-pale text-copper-deep" : "bg-danger-pale text-danger"}`}
          >
            {notice.kind === "ok" ? "✓ " : notice.kind === "conflict" ? "↻ " : "✕ "}
            {notice.text}
          </p>
        ) : null}
      </div>
      <DndContext
        sensors={sensors}
        collisionDetection={laneCollision}
        onDragStart={(e: DragStartEvent) => setActive(cardById(e.active.id))}
        onDragEnd={onDragEnd}
        onDragCancel={() => setActive(null)}
        accessibility={{ announcements, screenReaderInstructions: { draggable: "To pick up a proposal, press space or enter. Move between lanes with the left and right arrow keys, press space or enter to drop, or escape to cancel. Each card also has a Move to menu." } }}
      >
        <div className="flex gap-3 overflow-x-auto pb-4">{LANE_STAGES.map(renderLane)}</div>
        <details className="mt-4" open={ARCHIVE_STAGES.includes(active?.stage as Stage) || undefined}>
          <summary className="cursor-pointer font-semibold">
            Archive: declined and withdrawn ({board.cards.filter((c) => ARCHIVE_STAGES.includes(c.stage)).length})
          </summary>
          <div className="mt-3 flex gap-3 overflow-x-auto pb-4">{ARCHIVE_STAGES.map(renderLane)}</div>
        </details>
      </DndContext>
      {pending ? (
        <ReasonDialog
          title={`Move “${pending.card.title}” to ${STAGE_META[pending.to].label}`}
          onCancel={() => setPending(null)}
          onSubmit={(reason) => {
            const p = pending;
            setPending(null);
            void move(p.card, p.to, reason);
          }}
        />
      ) : null}
    </div>
  );
}
