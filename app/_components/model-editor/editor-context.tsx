"use client";

import { createContext, useContext } from "react";
import type { Draft, PathPart } from "./draft-path";

/** What every section needs: the draft, its base, edits, and where issues and ids live. */
export interface EditorApi {
  draft: Draft;
  base: unknown | null;
  /** DOM id of the input drawn for a field path (unique per editor on the page). */
  idFor(path: string): string;
  errorsAt(path: string): string[];
  warningsAt(path: string): string[];
  /** A plain value edit; `undefined` removes an optional field. */
  set(path: readonly PathPart[], value: unknown): void;
  /** A structural edit (orbitals, sites, shells) that keeps dependent parts in step. */
  apply(edit: (draft: Draft, base: unknown) => Draft): void;
}

export const EditorContext = createContext<EditorApi | null>(null);

export function useEditor(): EditorApi {
  const api = useContext(EditorContext);
  if (!api) throw new Error("model editor parts must sit inside ModelEditor");
  return api;
}
