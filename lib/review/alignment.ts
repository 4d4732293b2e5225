import { filledBands, valenceMaximum } from "./band-edges";
import { formatNumber } from "./band-format";
import type { BandViewData, BandViewReference } from "./band-view";

/**
 * Alignment of the band plot. The proposed revision is the anchor and is never shifted: the base release and each
 * reference set move onto it, so an energy window always means the same thing (the proposed document's energy scale),
 * as in the engine's reference comparison.
 */
export type Alignment = "none" | "vbm" | "fermi" | "least-squares";

export const ALIGNMENT_LABEL: Record<Alignment, string> = {
  none: "none (as computed)",
  vbm: "valence-band maximum",
  fermi: "Fermi level",
  "least-squares": "least squares in the window",
};

export interface AlignedSeries {
  base: number[][] | null;
  proposed: number[][];
  references: BandViewReference[];
  /** eV added to each series; null where the series could not be aligned (shown unshifted). */
  shifts: { base: number | null; references: Record<string, number | null> };
  shiftNote: string;
}

type Window = [number, number] | null;
const inWindow = (e: number, w: Window) => w === null || (e >= w[0] && e <= w[1]);

/** Mean of anchor − other over the (k, band) pairs whose anchor energy lies in the window: the least-squares shift. */
function meanDifference(anchor: number[][], other: (number | null)[][], window: Window): number | null {
  let sum = 0;
  let count = 0;
  other.forEach((row, k) => {
    for (let n = 0; n < row.length && n < (anchor[k]?.length ?? 0); n++) {
      const e = row[n];
      if (e === null || !Number.isFinite(e) || !inWindow(anchor[k][n], window)) continue;
      sum += anchor[k][n] - e;
      count++;
    }
  });
  return count > 0 ? sum / count : null;
}

/** Valence maxima over the k-points where the other series has a value, so partial reference sets compare fairly. */
function vbmShift(anchor: number[][], other: (number | null)[][], occupied: number | null): number | null {
  if (occupied === null) return null;
  const present = other.map((row, k) => (row[occupied - 1] === null || row[occupied - 1] === undefined ? [] : anchor[k]));
  const a = valenceMaximum(present, occupied);
  const b = valenceMaximum(other, occupied);
  return a === null || b === null ? null : a - b;
}

function shiftFor(view: BandViewData, alignment: Alignment, window: Window) {
  const occupied = filledBands(view.electronCount, view.spinDegeneracy);
  const diff = (a: number | null, b: number | null) => (a === null || b === null ? null : a - b);
  return {
    base(): number | null {
      if (!view.base) return null;
      if (alignment === "none") return 0;
      if (alignment === "vbm") return diff(view.proposedVbm, view.baseVbm);
      if (alignment === "fermi") return diff(view.proposedFermi, view.baseFermi);
      return meanDifference(view.proposed, view.base, window);
    },
    reference(r: BandViewReference): number | null {
      if (alignment === "none") return 0;
      if (alignment === "vbm") return vbmShift(r.proposedAt, r.energies, occupied);
      if (alignment === "fermi") return diff(view.proposedFermi, r.fermiLevel);
      return meanDifference(r.proposedAt, r.energies, window);
    },
  };
}

const signed = (v: number) => {
  const text = formatNumber(v, 3);
  return `${v > 0 && /[1-9]/.test(text) ? "+" : ""}${text} eV`;
};

function describe(alignment: Alignment, window: Window, named: { name: string; shift: number | null }[]): string {
  if (alignment === "none") return "Energies as computed: no series is shifted.";
  const target = {
    vbm: "so that their valence-band maxima meet the proposed revision's",
    fermi: "so that their Fermi levels meet the proposed revision's",
    "least-squares": `by the mean difference to the proposed revision ${window ? `over ${formatNumber(window[0], 2)} to ${formatNumber(window[1], 2)} eV` : "over all energies"}`,
  }[alignment];
  if (named.length === 0) return `Nothing to align: only the proposed revision is shown (alignment ${target}).`;
  const parts = named.map((s) => `${s.name} ${s.shift === null ? "not shifted (cannot be aligned this way)" : signed(s.shift)}`);
  return `Shifted ${target}: ${parts.join("; ")}.`;
}

const shiftRows = <T extends number | null>(rows: T[][], s: number): T[][] => rows.map((row) => row.map((e) => (e === null ? e : e + s)) as T[]);

export function alignSeries(view: BandViewData, alignment: Alignment, window: Window): AlignedSeries {
  const shift = shiftFor(view, alignment, window);
  const baseShift = shift.base();
  const refShifts: Record<string, number | null> = {};
  const references = view.references.map((r) => {
    const s = shift.reference(r);
    refShifts[r.id] = s;
    return s ? { ...r, energies: shiftRows(r.energies, s), fermiLevel: r.fermiLevel === null ? null : r.fermiLevel + s } : r;
  });
  const named = [
    ...(view.base ? [{ name: "base", shift: baseShift }] : []),
    ...view.references.map((r) => ({ name: r.name, shift: refShifts[r.id] })),
  ];
  return {
    base: view.base && baseShift ? shiftRows(view.base, baseShift) : view.base,
    proposed: view.proposed,
    references,
    shifts: { base: baseShift, references: refShifts },
    shiftNote: describe(alignment, window, named),
  };
}

/** The view with the aligned series put in, base edges and DOS energies moved with the base. */
export function alignedView(view: BandViewData, alignment: Alignment, window: Window): BandViewData & { shiftNote: string; baseShift: number } {
  const a = alignSeries(view, alignment, window);
  const s = a.shifts.base ?? 0;
  const move = (v: number | null) => (v === null ? null : v + s);
  return { ...view, base: a.base, references: a.references, baseFermi: move(view.baseFermi), baseVbm: move(view.baseVbm), shiftNote: a.shiftNote, baseShift: s };
}

/** ΔE = proposed − base per k and band (bands paired by index), and the largest |ΔE| per k inside the window. */
export function deltaE(view: BandViewData, window: Window = null): { perK: number[]; perBandK: number[][] } {
  if (!view.base) return { perK: [], perBandK: [] };
  const base = view.base;
  const perBandK = view.proposed.map((row, k) => row.slice(0, Math.min(row.length, base[k].length)).map((e, n) => e - base[k][n]));
  const perK = perBandK.map((row, k) => row.reduce((m, d, n) => (inWindow(view.proposed[k][n], window) ? Math.max(m, Math.abs(d)) : m), 0));
  return { perK, perBandK };
}
