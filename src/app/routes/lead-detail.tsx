import { Link, useParams } from "react-router";
import { RequireAction, useStaffUser } from "../RequireAction.tsx";
import { useLead, type LeadDetail } from "../../features/leads/api/leads.ts";
import { WorkPanel } from "../../features/leads/components/WorkPanel.tsx";
import { ReplyForm } from "../../features/leads/components/ReplyForm.tsx";
import { Conversation } from "../../features/leads/components/Conversation.tsx";
import { ageWords, formatWhen } from "../../features/leads/format.ts";
import { PageHeader, Panel } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";
import { CONTACT_LABELS } from "../../../shared/constants/leads.ts";

const tel = (phone: string) => `tel:${phone.replace(/[^\d+]/g, "")}`;

function Buyer({ lead }: { lead: LeadDetail }) {
  const t = lead.tradeIn;
  return (
    <Panel title="The buyer">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2">
        <dt className="text-ink-soft">Name</dt>
        <dd className="font-bold">{lead.name}</dd>
        <dt className="text-ink-soft">E-mail</dt>
        <dd>{lead.email ? <a href={`mailto:${lead.email}`} className="font-mono">{lead.email}</a> : <span className="text-ink-soft">Not given</span>}</dd>
        <dt className="text-ink-soft">Phone</dt>
        <dd>{lead.phone ? <a href={tel(lead.phone)} className="font-mono">{lead.phone}</a> : <span className="text-ink-soft">Not given</span>}</dd>
        <dt className="text-ink-soft">Prefers</dt>
        <dd>{CONTACT_LABELS[lead.preferredContact]}</dd>
        <dt className="text-ink-soft">Asked</dt>
        <dd className="figures">
          {formatWhen(lead.createdAt)} <span className="text-ink-soft">({lead.ageDays <= 0 ? "today" : `${ageWords(lead.ageDays)} ago`})</span>
        </dd>
        <dt className="text-ink-soft">Trade-in</dt>
        <dd>
          {t ? (
            <>
              {[t.year, t.make, t.model].filter(Boolean).join(" ") || "Offered"}
              {t.odometerKm != null ? (
                <span className="figures">
                  , {t.odometerKm.toLocaleString()}
                  {"\u2009"}
                  <span className="unit">km</span>
                </span>
              ) : null}
            </>
          ) : (
            <span className="text-ink-soft">None offered</span>
          )}
        </dd>
      </dl>
    </Panel>
  );
}

function LeadPage({ id }: { id: number }) {
  const me = useStaffUser();
  const q = useLead(id);
  if (q.isPending) return <Loading label="Loading the lead…" />;
  if (q.isError)
    return (
      <Notice tone="danger" title={q.error.status === 404 ? "There is no such lead" : "The lead could not be loaded"}>
        {q.error.message} <Link to="/app/leads">Back to the enquiries</Link>
      </Notice>
    );
  const lead = q.data.lead;
  const v = lead.vehicle;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to="/app/leads">← Enquiries</Link>
      </p>
      <PageHeader
        title={lead.name}
        lead={
          <>
            {lead.statusLabel}. About{" "}
            <Link to={`/app/vehicles/${lead.vehicleId}`}>{v?.title ?? `vehicle ${lead.vehicleId}`}</Link>
            {v ? <span className="font-mono text-sm"> · stock {v.stockNumber}</span> : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(18rem,2fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          <Panel title="Their question">
            <p className="whitespace-pre-wrap text-lg">{lead.message}</p>
            <p className="mt-4 text-sm text-ink-soft">
              {lead.revisionNumber ? (
                <>
                  They were reading{" "}
                  {v?.slug ? (
                    <a href={`/vehicles/${v.slug}/revisions/${lead.revisionNumber}`} target="_blank" rel="noreferrer">
                      revision {lead.revisionNumber} of the condition page
                    </a>
                  ) : (
                    `revision ${lead.revisionNumber} of the condition page`
                  )}
                  : what they saw is kept exactly as published.
                </>
              ) : (
                "Which revision they read was not recorded."
              )}
            </p>
          </Panel>
          <Buyer lead={lead} />
          <Panel title="Reply by e-mail">
            <ReplyForm lead={lead} />
          </Panel>
          <Panel title="Conversation">
            <Conversation items={lead.conversation} />
          </Panel>
        </div>
        <div className="flex flex-col gap-6">
          <Panel title="Work this lead">
            <WorkPanel lead={lead} me={me} onReload={() => void q.refetch()} reloading={q.isFetching} />
          </Panel>
        </div>
      </div>
    </>
  );
}

export default function LeadDetailRoute() {
  const { id } = useParams();
  const n = Number(id);
  return (
    <RequireAction action="leads.read">
      {Number.isInteger(n) && n > 0 ? <LeadPage key={n} id={n} /> : <Notice tone="danger" title="There is no such lead"><Link to="/app/leads">Back to the enquiries</Link></Notice>}
    </RequireAction>
  );
}
