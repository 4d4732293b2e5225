"use client";

import { ActionForm } from "@/app/_components/action-form";
import { ROLES, type Role } from "@/lib/auth/roles";
import { changeRolesAction, setActiveAction } from "./actions";

export interface PersonView {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  active: boolean;
  version: number;
}

export function PersonRow({ person, isSelf }: { person: PersonView; isSelf: boolean }) {
  return (
    <li className="grid gap-3 px-4 py-4 md:grid-cols-[17rem_1fr_auto]" data-testid={`person-${person.email}`}>
      <div>
        <div className="font-semibold">
          {person.name} {isSelf ? <span className="text-xs font-normal text-ink-soft">(you)</span> : null}
        </div>
        <div className="num text-xs text-ink-soft">{person.email}</div>
        {!person.active ? <div className="mt-1 inline-block rounded bg-danger-pale px-2 text-xs text-danger">deactivated</div> : null}
      </div>
      <ActionForm action={changeRolesAction} label={`Roles of ${person.name}`} className="flex flex-wrap items-center gap-3">
        {({ pending }) => (
          <>
            <input type="hidden" name="userId" value={person.id} />
            <input type="hidden" name="version" value={person.version} />
            {ROLES.map((role) => (
              <label key={role} className="flex items-center gap-1 text-sm">
                <input type="checkbox" name="roles" value={role} defaultChecked={person.roles.includes(role)} className="accent-copper" />
                {role}
              </label>
            ))}
            <button type="submit" disabled={pending} className="rounded border border-rule px-2 py-0.5 text-sm hover:border-copper">
              Save roles
            </button>
          </>
        )}
      </ActionForm>
      <ActionForm action={setActiveAction} label={`Access of ${person.name}`}>
        {({ pending }) => (
          <>
            <input type="hidden" name="userId" value={person.id} />
            <input type="hidden" name="version" value={person.version} />
            <input type="hidden" name="active" value={person.active ? "false" : "true"} />
            <button type="submit" disabled={pending || isSelf} className="rounded border border-rule px-2 py-0.5 text-sm hover:border-copper disabled:opacity-50">
              {person.active ? "Deactivate" : "Reactivate"}
            </button>
          </>
        )}
      </ActionForm>
    </li>
  );
}
