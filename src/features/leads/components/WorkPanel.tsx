import { useState, type FormEvent } from "react";
import { useUpdateLead, type LeadDetail } from "../api/leads.ts";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "../../../lib/api-client.ts";
import { usersQueryOptions } from "../../users/api/users.ts";
import { SelectField, TextAreaField, TextField } from "../../../components/form/Field.tsx";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { LEAD_STATUSES, LEAD_STATUS_LABELS, type LeadStatus } from "../../../../shared/constants/leads.ts";
import type { SessionUser } from "../../../../shared/schemas/auth.ts";
import { can } from "../../../../shared/permissions.ts";
import { useDealershipDay } from "../../settings/api/dealership.ts";
import { followUpState } from "../format.ts";

interface Edits {
  status?: LeadStatus;
  assigneeId?: string | null;
  followUpOn?: string | null;
}

/** Admins may hand a lead to anyone who sells; the list is the admin-only staff list. */
const useAssignable = (enabled: boolean) =>
  useQuery({
    ...usersQueryOptions(),
    enabled,
    select: (d) => d.users.filter((u) => u.active && can(u, "leads.work")),
  });

/**
 * Status, assignee, follow-up and a note, saved together against the lead's version. Only what the person changed is
 * sent; after a 409 the fresh lead is loaded under the same edits, so nothing typed is lost.
 */
export function WorkPanel({ lead, me, onReload, reloading }: { lead: LeadDetail; me: SessionUser; onReload: () => void; reloading: boolean }) {
  const update = useUpdateLead(lead.id);
  const [edits, setEdits] = useState<Edits>({});
  const [note, setNote] = useState("");
  const [saved, setSaved] = useState<string | null>(null);
  const [pending, setPending] = useState<"take" | "save" | null>(null);
  const mayAssign = can(me, "leads.assign");
  const people = useAssignable(mayAssign);
  const today = useDealershipDay();

  const status = edits.status ?? lead.status;
  const assigneeId = edits.assigneeId !== undefined ? edits.assigneeId : lead.assigneeId;
  const followUpOn = edits.followUpOn !== undefined ? edits.followUpOn : lead.followUpOn;
  const changed = {
    ...(edits.status !== undefined && edits.status !== lead.status ? { status: edits.status } : {}),
    ...(edits.assigneeId !== undefined && edits.assigneeId !== lead.assigneeId ? { assigneeId: edits.assigneeId } : {}),
    ...(edits.followUpOn !== undefined && edits.followUpOn !== lead.followUpOn ? { followUpOn: edits.followUpOn } : {}),
    ...(note.trim() ? { note: note.trim() } : {}),
  };
  const dirty = Object.keys(changed).length > 0;
  const error = update.error;
  const stale = isApiError(error) && error.status === 409;
  const fields = isApiError(error) ? error.fields : {};

  function save(input: typeof changed, done: string, kind: "take" | "save" = "save") {
    setSaved(null);
    setPending(kind);
    update.mutate(
      { version: lead.version, ...input },
      {
        onSuccess: () => {
          setEdits((e) => {
            const rest = { ...e };
            for (const k of Object.keys(input)) delete rest[k as keyof Edits];
            return rest;
          });
          if ("note" in input) setNote("");
          setSaved(done);
        },
      },
    );
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!dirty) return;
    save(changed, "Saved.");
  }

  function reload() {
    update.reset();
    onReload();
  }

  const due = followUpState(followUpOn, today);
  const assigneeWords = lead.assigneeId ? (lead.assigneeId === me.id ? "You" : lead.assigneeName ?? "Someone") : "Nobody yet";

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Work this lead">
      {stale ? (
        <Notice tone="caution" title="Someone else changed this lead while you were working">
          <p>Load their changes; what you chose and typed here stays as it is, and you can save again.</p>
          <Button type="button" tone="secondary" className="mt-2" busy={reloading} onClick={reload}>
            Load the latest and keep my changes
          </Button>
        </Notice>
      ) : error && !Object.keys(fields).length ? (
        <Notice tone="danger" title="Not saved">{error.message} What you typed is still here.</Notice>
      ) : saved ? (
        <Notice tone="success" title={saved} />
      ) : null}

      <SelectField label="Status" name="status" value={status} onChange={(e) => setEdits({ ...edits, status: e.target.value as LeadStatus })} error={fields.status}>
        {LEAD_STATUSES.map((s) => (
          <option key={s} value={s}>
            {LEAD_STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>

      {mayAssign ? (
        <SelectField
          label="Assigned to"
          name="assigneeId"
          value={assigneeId ?? ""}
          onChange={(e) => setEdits({ ...edits, assigneeId: e.target.value || null })}
          error={fields.assigneeId ?? (people.isError ? `The staff list could not be loaded: ${people.error.message}` : undefined)}
        >
          <option value="">Nobody yet</option>
          {lead.assigneeId && !people.data?.some((u) => u.id === lead.assigneeId) ? <option value={lead.assigneeId}>{lead.assigneeName ?? "Current assignee"}</option> : null}
          {(people.data ?? []).map((u) => (
            <option key={u.id} value={u.id}>
              {u.name}
              {u.id === me.id ? " (you)" : ""}
            </option>
          ))}
        </SelectField>
      ) : (
        <div className="flex flex-col gap-1">
          <p className="text-sm font-bold">Assigned to</p>
          <div className="flex flex-wrap items-center gap-3">
            <span>{assigneeWords}</span>
            {lead.assigneeId !== me.id ? (
              <Button type="button" tone="secondary" busy={update.isPending && pending === "take"} onClick={() => save({ assigneeId: me.id } as typeof changed, "The lead is yours.", "take")}>
                Take this lead
              </Button>
            ) : null}
          </div>
          {fields.assigneeId ? <p className="text-sm font-bold text-brick">{fields.assigneeId}</p> : null}
        </div>
      )}

      <TextField
        label="Follow up on"
        name="followUpOn"
        type="date"
        value={followUpOn ?? ""}
        onChange={(e) => setEdits({ ...edits, followUpOn: e.target.value || null })}
        error={fields.followUpOn}
        hint={due.word === "overdue" ? <strong className="text-brick">Overdue: the buyer is waiting.</strong> : due.word === "today" ? "Due today." : "Leave empty for no reminder."}
      />

      <TextAreaField label="Add a note" name="note" value={note} onChange={(e) => setNote(e.target.value)} error={fields.note} rows={3} hint="For the team only; the buyer never sees notes." />

      <Button type="submit" busy={update.isPending && pending === "save"} disabled={!dirty || stale}>
        Save changes
      </Button>
    </form>
  );
}
