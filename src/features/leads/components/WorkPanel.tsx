import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { useUpdateLead, type LeadDetail } from "../api/leads.ts";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "../../../lib/api-client.ts";
import { usersQueryOptions } from "../../users/api/users.ts";
import { SelectField, TextAreaField, TextField } from "../../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { LEAD_STATUSES, LEAD_STATUS_LABELS, type LeadStatus } from "../../../../shared/constants/leads.ts";
import type { SessionUser } from "../../../../shared/schemas/auth.ts";
import { can } from "../../../../shared/permissions.ts";
import { useDealershipDay } from "../../settings/api/dealership.ts";
import { followUpState } from "../format.ts";

/** What the form holds: the lead's fields as the inputs show them ("" for none), and the note being typed. */
interface WorkValues {
  status: LeadStatus;
  assigneeId: string;
  followUpOn: string;
  note: string;
}

const fromLead = (lead: LeadDetail): WorkValues => ({ status: lead.status, assigneeId: lead.assigneeId ?? "", followUpOn: lead.followUpOn ?? "", note: "" });

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
  // The lead as loaded is the form's base; a newer lead (after a reload) replaces only what the person has not touched.
  const base = useMemo(() => fromLead(lead), [lead]);
  const form = useForm<WorkValues>({ values: base, resetOptions: { keepDirtyValues: true } });
  const { errors } = form.formState;
  const { status = lead.status, assigneeId: assigneeText = "", followUpOn: followUpText = "", note = "" } = useWatch({ control: form.control });
  const [saved, setSaved] = useState<string | null>(null);
  const [pending, setPending] = useState<"take" | "save" | null>(null);
  const mayAssign = can(me, "leads.assign");
  const people = useAssignable(mayAssign);
  const today = useDealershipDay();

  const assigneeId = assigneeText || null;
  const followUpOn = followUpText || null;
  const changed = {
    ...(status !== lead.status ? { status } : {}),
    ...(assigneeId !== lead.assigneeId ? { assigneeId } : {}),
    ...(followUpOn !== lead.followUpOn ? { followUpOn } : {}),
    ...(note.trim() ? { note: note.trim() } : {}),
  };
  const dirty = Object.keys(changed).length > 0;
  const error = update.error;
  const stale = isApiError(error) && error.status === 409;
  const fields = isApiError(error) ? error.fields : {};
  const message = (k: keyof WorkValues) => errors[k]?.message;

  function save(input: typeof changed, done: string, kind: "take" | "save" = "save") {
    setSaved(null);
    setPending(kind);
    update.mutate(
      { version: lead.version, ...input },
      {
        onSuccess: () => {
          // What was saved is now the lead's own value: no longer an edit to keep over a newer lead.
          for (const k of Object.keys(input) as Array<keyof typeof input>)
            if (k === "note") form.resetField("note", { defaultValue: "" });
            else form.resetField(k, { defaultValue: input[k] ?? "" });
          setSaved(done);
        },
        onError: (e) => setServerErrors(form, e),
      },
    );
  }

  const submit = form.handleSubmit(() => {
    if (dirty) save(changed, "Saved.");
  });

  function reload() {
    update.reset();
    onReload();
  }

  const due = followUpState(followUpOn, today);
  const assigneeWords = lead.assigneeId ? (lead.assigneeId === me.id ? "You" : lead.assigneeName ?? "Someone") : "Nobody yet";

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-4" aria-label="Work this lead">
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

      <SelectField label="Status" {...form.register("status")} error={message("status")}>
        {LEAD_STATUSES.map((s) => (
          <option key={s} value={s}>
            {LEAD_STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>

      {mayAssign ? (
        // Controlled: its options arrive with the staff list, after the form has its value.
        <SelectField
          label="Assigned to"
          {...form.register("assigneeId")}
          value={assigneeText}
          error={message("assigneeId") ?? (people.isError ? `The staff list could not be loaded: ${people.error.message}` : undefined)}
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
              <Button type="button" tone="secondary" busy={update.isPending && pending === "take"} onClick={() => save({ assigneeId: me.id }, "The lead is yours.", "take")}>
                Take this lead
              </Button>
            ) : null}
          </div>
          {message("assigneeId") ? <p className="text-sm font-bold text-brick">{message("assigneeId")}</p> : null}
        </div>
      )}

      <TextField
        label="Follow up on"
        type="date"
        {...form.register("followUpOn")}
        error={message("followUpOn")}
        hint={due.word === "overdue" ? <strong className="text-brick">Overdue: the buyer is waiting.</strong> : due.word === "today" ? "Due today." : "Leave empty for no reminder."}
      />

      <TextAreaField label="Add a note" {...form.register("note")} error={message("note")} rows={3} hint="For the team only; the buyer never sees notes." />

      <Button type="submit" busy={update.isPending && pending === "save"} disabled={!dirty || stale}>
        Save changes
      </Button>
    </form>
  );
}
