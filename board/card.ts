import type { Stage } from "./stages";

/** What the board shows of one proposal (also the JSON of GET /api/board). */
export interface BoardCard {
  id: string;
  title: string;
  stage: Stage;
  version: number;
  updatedAt: string;
  authorId: string;
  authorName: string;
  familySlug: string;
  familyTitle: string;
  requiredAccepts: number;
  baseVersion: string | null;
  revision: number;
  checksPassing: boolean;
  checksWaived: boolean;
  shiftProfile: number[] | null;
  maxShift: number | null;
  reviewers: { id: string; name: string }[];
  tally: { accept: number; minor_revision: number; major_revision: number; decline: number; stale: number };
  openBlockingRemarks: number;
}
