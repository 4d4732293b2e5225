"use client";

import { ActionForm } from "@/app/_components/action-form";
import { assignReviewerAction, unassignReviewerAction } from "../actions";

export function ReviewersPanel({
  proposalId,
  version,
  reviewers,
  candidates,
  canManage,
}: {
  proposalId: string;
  version: number;
  reviewers: { id: string; name: string }[];
  candidates: { id: string; name: string }[];
  canManage: boolean;
}) {
  const open = candidates.filter((c) => !reviewers.some((r) => r.id === c.id));
  return (
    <div className="space-y-3">
      <ul className="space-y-1">
        {reviewers.map((r) => (
          <li key={r.id} className="flex items-center gap-3">
            <span>{r.name}</span>
            {canManage ? (
              <ActionForm action={unassignReviewerAction} label={`Remove ${r.name}`}>
                {({ pending }) => (
                  <>
                    <input type="hidden" name="proposalId" value={proposalId} />
                    <input type="hidden" name="version" value={version} />
                    <input type="hidden" name="reviewerId" value={r.id} />
                    <button type="submit" disabled={pending} className="text-xs text-copper-deep underline">
                      remove
                    </button>
                  </>
                )}
              </ActionForm>
            ) : null}
          </li>
        ))}
        {reviewers.length === 0 ? <li className="text-sm text-ink-soft">No reviewers assigned yet.</li> : null}
      </ul>
      {canManage && open.length > 0 ? (
        <ActionForm action={assignReviewerAction} label="Assign a reviewer" className="flex items-end gap-2">
          {({ pending }) => (
            <>
              <input type="hidden" name="proposalId" value={proposalId} />
              <input type="hidden" name="version" value={version} />
              <label className="text-sm">
                <span className="mb-1 block font-semibold">Assign a reviewer</span>
                <select name="reviewerId" className="rounded border border-rule bg-white px-2 py-1">
                  {open.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name}
                    </option>
                  ))}
                </select>
              </label>
              <button type="submit" disabled={pending} className="rounded-md border border-copper px-3 py-1 text-sm font-semibold text-copper-deep">
                Assign
              </button>
            </>
          )}
        </ActionForm>
      ) : null}
    </div>
  );
}
