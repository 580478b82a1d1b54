"use client";

import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { useActionState, useState } from "react";
import { changeMemberRoleAction, removeMemberAction } from "@/app/(lab)/labs/[slug]/members/actions";
import type { ActionState } from "@/lib/http/action";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/permissions";
import { FormStatus } from "@/components/ui/form-status";
import { buttonClass } from "@/components/ui/button";
import { formatDate } from "@/lib/format/dates";

export type MemberView = { id: number; userId: number; name: string; email: string; role: Role; joinedAt: Date };

const col = createColumnHelper<MemberView>();

// One state for every row's forms, so the outcome stays on screen even when the row goes away.
async function memberIntent(prev: ActionState, form: FormData): Promise<ActionState> {
  return form.get("intent") === "remove" ? removeMemberAction(prev, form) : changeMemberRoleAction(prev, form);
}

export function MembersTable({
  slug,
  members,
  meUserId,
  timeZone,
}: {
  slug: string;
  members: MemberView[];
  meUserId: number;
  /** The lab's IANA time zone: dates are shown in it. */
  timeZone: string;
}) {
  const [state, action, pending] = useActionState<ActionState, FormData>(memberIntent, {});
  const [sorting, setSorting] = useState<SortingState>([]);
  const managers = members.filter((m) => m.role === "manager").length;
  const onlyManager = (m: MemberView) => m.role === "manager" && managers <= 1;

  const columns = [
    col.accessor("name", {
      header: "Name",
      cell: (c) => (
        <span className="font-medium">
          {c.getValue()}
          {c.row.original.userId === meUserId ? (
            <span className="ml-2 rounded bg-brand-50 px-1.5 py-0.5 text-xs font-semibold text-brand-700">you</span>
          ) : null}
        </span>
      ),
    }),
    col.accessor("email", {
      header: "E-mail",
      cell: (c) => <span className="break-words text-ink-soft">{c.getValue()}</span>,
    }),
    col.accessor("role", {
      header: "Role",
      sortingFn: (a, b) => ROLES.indexOf(a.original.role) - ROLES.indexOf(b.original.role),
      cell: (c) => {
        const m = c.row.original;
        return (
          <form action={action} className="flex items-center gap-2">
            <input type="hidden" name="slug" value={slug} />
            <input type="hidden" name="intent" value="role" />
            <input type="hidden" name="membershipId" value={m.id} />
            <label htmlFor={`role-${m.id}`} className="sr-only">
              Role of {m.name}
            </label>
            <select
              id={`role-${m.id}`}
              name="role"
              defaultValue={m.role}
              key={m.role}
              disabled={onlyManager(m)}
              className="rounded-md border border-line-strong bg-white px-2 py-1 disabled:bg-paper-sunk"
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
            {onlyManager(m) ? (
              <span className="text-xs text-ink-faint">only manager</span>
            ) : (
              <button type="submit" disabled={pending} className={buttonClass("secondary", "px-3 py-1")}>
                Save<span className="sr-only"> role of {m.name}</span>
              </button>
            )}
          </form>
        );
      },
    }),
    col.accessor("joinedAt", {
      header: "Joined",
      cell: (c) => <span className="whitespace-nowrap text-ink-soft">{formatDate(c.getValue(), timeZone)}</span>,
    }),
    col.display({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: (c) => (
        <RemoveMember
          member={c.row.original}
          slug={slug}
          action={action}
          pending={pending}
          disabled={onlyManager(c.row.original)}
          self={c.row.original.userId === meUserId}
        />
      ),
    }),
  ];

  // The React Compiler is not enabled here; TanStack Table keeps its own state.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: members,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="space-y-3">
      <FormStatus ok={state.ok} message={state.message} />
      <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
        <table className="w-full min-w-[44rem] text-left text-sm">
          <caption className="sr-only">Members of the lab</caption>
          <thead className="border-b border-line bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      className="px-4 py-2 font-semibold"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                    >
                      {h.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={h.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 uppercase hover:text-ink"
                        >
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden>{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className="border-b border-line last:border-0"
                data-testid={`member-${row.original.email}`}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2 align-middle">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function RemoveMember({
  member,
  slug,
  action,
  pending,
  disabled,
  self,
}: {
  member: MemberView;
  slug: string;
  action: (f: FormData) => void;
  pending: boolean;
  disabled: boolean;
  self: boolean;
}) {
  const [confirming, setConfirming] = useState(false);
  if (disabled) return <span className="text-xs text-ink-faint">A lab keeps one manager</span>;
  if (!confirming) {
    return (
      <button type="button" onClick={() => setConfirming(true)} className={buttonClass("ghost", "px-3 py-1")}>
        Remove…<span className="sr-only"> {member.name}</span>
      </button>
    );
  }
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="intent" value="remove" />
      <input type="hidden" name="membershipId" value={member.id} />
      <span className="text-xs">
        {self ? "Remove yourself? You lose access to this lab." : `Remove ${member.name}?`}
      </span>
      <button type="submit" disabled={pending} className={buttonClass("danger", "px-3 py-1")} autoFocus>
        Confirm removal
      </button>
      <button type="button" onClick={() => setConfirming(false)} className={buttonClass("secondary", "px-3 py-1")}>
        Cancel
      </button>
    </form>
  );
}
