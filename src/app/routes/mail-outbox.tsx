import { useOutbox, useRetryOutbox } from "../../features/mail/api/mail.ts";
import { OutboxTable } from "../../features/mail/components/OutboxTable.tsx";
import { CapturedMail } from "../../features/mail/components/CapturedMail.tsx";
import { PageHeader } from "../../components/ui/Page.tsx";
import { Button } from "../../components/ui/Button.tsx";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";

/** Guarded by its action in app/router.tsx. */
export default function MailPage() {
  const outbox = useOutbox();
  const retry = useRetryOutbox();
  const waiting = outbox.data?.outbox.filter((m) => m.status !== "sent").length ?? 0;
  return (
    <>
      <PageHeader
        title="Mail"
        lead="Every mail Forthright sends waits in this outbox until the mail server takes it, so an outage only delays mail. Failed mail is tried again by itself; Retry now tries at once."
        actions={
          <Button type="button" tone="secondary" busy={retry.isPending} onClick={() => retry.mutate()}>
            Retry now
          </Button>
        }
      />
      <div className="flex flex-col gap-8">
        {retry.isSuccess ? <Notice tone="success" title="Tried again">{waiting ? `${waiting} still waiting; see the last error for why.` : "Nothing is waiting."}</Notice> : null}
        {retry.isError ? <Notice tone="danger" title="Could not retry">{retry.error.message}</Notice> : null}
        <section aria-labelledby="outbox-h">
          <h2 id="outbox-h" className="mb-3 text-lg font-bold">Outbox</h2>
          {outbox.isPending ? (
            <Loading />
          ) : outbox.isError ? (
            <Notice tone="danger" title="The outbox could not be loaded">{outbox.error.message}</Notice>
          ) : outbox.data.outbox.length ? (
            <OutboxTable rows={outbox.data.outbox} />
          ) : (
            <EmptyState title="No mail yet">Enquiries, replies, invitations and password resets appear here as they are sent.</EmptyState>
          )}
        </section>
        {outbox.data?.demo ? (
          <section aria-labelledby="captured-h">
            <h2 id="captured-h" className="mb-1 text-lg font-bold">Captured by the demo mail catcher</h2>
            <p className="mb-3 max-w-prose text-sm text-ink-soft">
              Demo mode only. No mail server is set up, so Forthright's own catcher receives every mail and keeps it here; nothing reaches
              a real inbox. With a mail server configured this list does not exist.
            </p>
            <CapturedMail />
          </section>
        ) : null}
      </div>
    </>
  );
}
