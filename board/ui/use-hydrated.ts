"use client";

import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

/** False in the server render and during hydration, true once the page runs in the browser. */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
