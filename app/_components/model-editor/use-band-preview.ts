"use client";

import { useEffect, useRef, useState } from "react";
import type { ModelDocument } from "@/lib/tb/document";
import type { PreviewRequest, PreviewResponse, PreviewResult } from "./preview-protocol";

const DEBOUNCE_MS = 120;

export interface BandPreview {
  /** The newest result shown; it may belong to an older document (see `stale` in the panel). */
  result: PreviewResult | null;
  /** A newer document has been sent and its bands are not back yet. */
  computing: boolean;
  /** The last computation of a valid document failed in the engine. */
  failure: string | null;
  /** The worker could not start or crashed: no preview at all. */
  unavailable: string | null;
}

/** Only what changes the bands or checks; edits to names, citations or provenance do not recompute. */
function bandsKey(doc: ModelDocument): string {
  const { lattice, sites, onsite, shells, hoppings, spinOrbit, electronCount, kPath, conventions } = doc;
  return JSON.stringify([lattice, sites, onsite, shells, hoppings, spinOrbit, electronCount, kPath, conventions.blochPhase]);
}

/**
 * Band preview of `doc` computed in a Web Worker: debounced, numbered, and results older than the one shown are
 * dropped. A null `doc` (invalid draft) sends nothing, so the last good result stays on screen.
 */
export function useBandPreview(doc: ModelDocument | null, base: ModelDocument | null): BandPreview {
  const worker = useRef<Worker | null>(null);
  const sent = useRef({ seq: 0, key: "" });
  const shown = useRef(0);
  const [state, setState] = useState<BandPreview>({ result: null, computing: false, failure: null, unavailable: null });

  useEffect(() => {
    let instance: Worker;
    try {
      instance = new Worker(new URL("./bands.worker.ts", import.meta.url), { type: "module" });
    } catch (error) {
      setState((s) => ({ ...s, unavailable: error instanceof Error ? error.message : "the browser refused the worker" }));
      return;
    }
    instance.onmessage = (event: MessageEvent<PreviewResponse>) => {
      const response = event.data;
      if (response.seq <= shown.current) return;
      shown.current = response.seq;
      const computing = response.seq < sent.current.seq;
      setState((s) =>
        response.kind === "result"
          ? { result: response, computing, failure: null, unavailable: null }
          : { ...s, computing, failure: response.message },
      );
    };
    instance.onerror = (event) => {
      event.preventDefault();
      setState((s) => ({ ...s, computing: false, unavailable: event.message || "the band worker stopped" }));
    };
    worker.current = instance;
    return () => {
      instance.terminate();
      worker.current = null;
      sent.current = { seq: sent.current.seq, key: "" };
    };
  }, []);

  useEffect(() => {
    worker.current?.postMessage({ kind: "base", doc: base } satisfies PreviewRequest);
    sent.current = { ...sent.current, key: "" };
  }, [base]);

  useEffect(() => {
    if (!doc) return;
    const key = bandsKey(doc);
    if (key === sent.current.key) return;
    setState((s) => (s.computing ? s : { ...s, computing: true }));
    const timer = setTimeout(() => {
      if (!worker.current) return;
      const seq = sent.current.seq + 1;
      sent.current = { seq, key };
      worker.current.postMessage({ kind: "proposal", seq, doc } satisfies PreviewRequest);
    }, DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [doc, base]);

  return state;
}
