"use client";

import { usePathname, useRouter } from "next/navigation";
import type { BoardFilters } from "../schemas";
import { STAGE_META, STAGES } from "../stages";

export function filtersToQuery(f: BoardFilters): string {
  const q = new URLSearchParams();
  if (f.family.length) q.set("family", f.family.join(","));
  if (f.stage.length) q.set("stage", f.stage.join(","));
  if (f.mine) q.set("mine", f.mine);
  if (f.author) q.set("author", f.author);
  return q.toString();
}

/** Filters live in the URL, so a filtered board can be bookmarked and shared. */
export function BoardFilterBar({ filters, families, authors }: { filters: BoardFilters; families: { slug: string; title: string }[]; authors: { id: string; name: string }[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const apply = (next: BoardFilters) => {
    const q = filtersToQuery(next);
    router.replace(q ? `${pathname}?${q}` : pathname, { scroll: false });
  };
  return (
    <form aria-label="Board filters" className="mb-4 flex flex-wrap items-end gap-4 rounded-xl border border-rule bg-card px-4 py-3 text-sm" onSubmit={(e) => e.preventDefault()}>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Family</span>
        <select value={filters.family[0] ?? ""} onChange={(e) => apply({ ...filters, family: e.target.value ? [e.target.value] : [] })} className="rounded border border-rule bg-white px-2 py-1">
          <option value="">all families</option>
          {families.map((f) => (
            <option key={f.slug} value={f.slug}>
              {f.title}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Stage</span>
        <select value={filters.stage[0] ?? ""} onChange={(e) => apply({ ...filters, stage: e.target.value ? [e.target.value as (typeof STAGES)[number]] : [] })} className="rounded border border-rule bg-white px-2 py-1">
          <option value="">all stages</option>
          {STAGES.map((s) => (
            <option key={s} value={s}>
              {STAGE_META[s].glyph} {STAGE_META[s].label}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Author</span>
        <select value={filters.author ?? ""} onChange={(e) => apply({ ...filters, author: e.target.value || undefined })} className="rounded border border-rule bg-white px-2 py-1">
          <option value="">anyone</option>
          {authors.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="flex items-center gap-3">
        <legend className="sr-only">Mine</legend>
        <label className="flex items-center gap-1">
          <input type="checkbox" className="accent-copper" checked={filters.mine === "assigned"} onChange={(e) => apply({ ...filters, mine: e.target.checked ? "assigned" : undefined })} />
          assigned to me
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" className="accent-copper" checked={filters.mine === "authored"} onChange={(e) => apply({ ...filters, mine: e.target.checked ? "authored" : undefined })} />
          written by me
        </label>
      </fieldset>
      {filtersToQuery(filters) ? (
        <button type="button" onClick={() => apply({ family: [], stage: [] })} className="text-copper-deep underline">
          clear filters
        </button>
      ) : null}
    </form>
  );
}
