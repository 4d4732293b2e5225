"use client";

import { useRouter } from "next/navigation";
import { useRef } from "react";
import { inputClass } from "@/app/_components/form-parts";

type Option = { value: string; label: string };

/**
 * Any two sides to compare (the base release or a revision), kept in ?from=&to= so the choice can be linked; other
 * query parameters are kept. A plain GET form underneath, so it also works before the script loads.
 */
export function RevisionPairPicker({ options, from, to }: { options: Option[]; from: string; to: string }) {
  // Keyed by the current pair: the selects start from the URL's pair again after each navigation.
  return <PairForm key={`${from}|${to}`} options={options} from={from} to={to} />;
}

function PairForm({ options, from, to }: { options: Option[]; from: string; to: string }) {
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const go = (swap = false) => {
    const data = new FormData(form.current ?? undefined);
    const [a, b] = [String(data.get("from") ?? from), String(data.get("to") ?? to)];
    const url = new URL(window.location.href);
    url.searchParams.set("from", swap ? b : a);
    url.searchParams.set("to", swap ? a : b);
    url.hash = "";
    router.push(`${url.pathname}${url.search}`, { scroll: false });
  };
  const select = (name: "from" | "to", label: string, value: string) => (
    <label className="min-w-0 flex-1 text-sm">
      <span className="mb-1 block font-semibold">{label}</span>
      <select name={name} defaultValue={value} onChange={() => go()} className={`${inputClass} py-1.5`}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
  return (
    <form
      ref={form}
      method="get"
      className="mb-4 rounded-lg border border-rule bg-card p-3"
      onSubmit={(e) => {
        e.preventDefault();
        go();
      }}
    >
      <div className="flex flex-wrap items-end gap-3">
        {select("from", "Compare from", from)}
        <button type="button" onClick={() => go(true)} aria-label="Swap the two sides" className="mb-0.5 rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-paper-deep">
          ⇄ Swap
        </button>
        {select("to", "to", to)}
        <noscript>
          <button type="submit" className="rounded-md border border-rule px-3 py-1.5 text-sm">
            Compare
          </button>
        </noscript>
      </div>
      {from === to ? <p className="mt-2 text-xs text-ink-soft">Both sides are the same; choose two different versions to see a change.</p> : null}
    </form>
  );
}
