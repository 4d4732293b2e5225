"use client";

import { useRouter } from "next/navigation";
import { inputClass } from "@/app/_components/form-parts";

/**
 * Any two sides to compare (the base release or a revision), kept in ?from=&to= so the choice can be linked.
 * A plain GET form underneath, so it works before the script loads; other query parameters are kept.
 */
export function RevisionPairPicker({ options, from, to }: { options: { value: string; label: string }[]; from: string; to: string }) {
  const router = useRouter();
  const go = (next: { from: string; to: string }) => {
    const url = new URL(window.location.href);
    url.searchParams.set("from", next.from);
    url.searchParams.set("to", next.to);
    url.hash = "";
    router.push(`${url.pathname}${url.search}`, { scroll: false });
  };
  const select = (name: "from" | "to", label: string, value: string) => (
    <label className="min-w-0 flex-1 text-sm">
      <span className="mb-1 block font-semibold">{label}</span>
      <select name={name} value={value} className={`${inputClass} py-1.5`}
        onChange={(e) => go(name === "from" ? { from: e.target.value, to } : { from, to: e.target.value })}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>{o.label}</option>
        ))}
      </select>
    </label>
  );
  return (
    <form method="get" className="mb-4 rounded-lg border border-rule bg-card p-3"
      onSubmit={(e) => {
        e.preventDefault();
        go({ from, to });
      }}>
      <div className="flex flex-wrap items-end gap-3">
        {select("from", "Compare from", from)}
        <button type="button" onClick={() => go({ from: to, to: from })} className="mb-0.5 rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-paper-deep"
          aria-label="Swap the two sides">
          ⇄ Swap
        </button>
        {select("to", "to", to)}
        <noscript>
          <button type="submit" className="rounded-md border border-rule px-3 py-1.5 text-sm">Compare</button>
        </noscript>
      </div>
      {from === to ? <p className="mt-2 text-xs text-ink-soft">Both sides are the same; choose two different versions to see a change.</p> : null}
    </form>
  );
}
