"use client";

import { useState } from "react";
import type { KeyedMutator } from "swr";
import { ApiError, fetchJson } from "@/lib/client-fetch";
import type { BoardCard } from "../card";
import { STAGE_META, type Stage } from "../stages";

export interface BoardData {
  cards: BoardCard[];
  families: { id: string; slug: string; title: string; curatorIds: string[] }[];
}

export interface MoveNotice {
  kind: "ok" | "refused" | "conflict";
  text: string;
}

/**
 * Sends a move to the server (the only judge), shows the card in its new lane meanwhile, and puts it back with the
 * server's reason when refused. A 409 means someone else moved first: the board reloads and says what changed.
 */
export function useCardMoves(mutate: KeyedMutator<BoardData>) {
  const [busy, setBusy] = useState<string | null>(null);
  const [notice, setNotice] = useState<MoveNotice | null>(null);

  async function move(card: BoardCard, to: Stage, reason?: string) {
    setBusy(card.id);
    setNotice(null);
    const optimistic = (data?: BoardData): BoardData =>
      data ? { ...data, cards: data.cards.map((c) => (c.id === card.id ? { ...c, stage: to } : c)) } : { cards: [], families: [] };
    try {
      await mutate(
        async (data) => {
          const { card: moved } = await fetchJson<{ card: BoardCard }>(`/api/proposals/${card.id}/moves`, { method: "POST", body: { version: card.version, to, reason } });
          return data && { ...data, cards: data.cards.map((c) => (c.id === card.id ? moved : c)) };
        },
        { optimisticData: optimistic, rollbackOnError: true, revalidate: false },
      );
      setNotice({ kind: "ok", text: `Moved “${card.title}” to ${STAGE_META[to].label}.` });
    } catch (err) {
      const e = err instanceof ApiError ? err : new ApiError(0, "internal:error", "The move could not be sent. Check your connection.");
      if (e.code === "conflict:stale") {
        setNotice({ kind: "conflict", text: e.message });
        await mutate();
      } else {
        const reasons = (e.details?.reasons as string[] | undefined) ?? [e.message];
        setNotice({ kind: "refused", text: `“${card.title}” stays in ${STAGE_META[card.stage].label}: ${reasons.join(" ")}` });
      }
    } finally {
      setBusy(null);
    }
  }

  return { move, busy, notice, clearNotice: () => setNotice(null) };
}
