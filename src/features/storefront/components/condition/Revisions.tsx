import { Link } from "react-router";
import type { RevisionSummary } from "../../../../../shared/schemas/public.ts";
import type { PublicDealership } from "../../../../../shared/schemas/dealership.ts";
import { publishedText } from "../../format.ts";
import { Section } from "./Section.tsx";

interface Props {
  slug: string;
  revisions: RevisionSummary[];
  viewing: number;
  latest: number;
  dealership: PublicDealership;
}

/** Every published revision, newest first, with what changed; each older one stays readable as it was. */
export function Revisions({ slug, revisions, viewing, latest, dealership }: Props) {
  const list = [...revisions].sort((a, b) => b.number - a.number);
  return (
    <Section
      id="revisions"
      title="Revisions of this report"
      lead={<p>Each time we change this report we publish a new revision. Earlier revisions are kept exactly as they were published.</p>}
    >
      <ol className="flex flex-col gap-4">
        {list.map((r) => {
          const href = r.number === latest ? `/vehicles/${encodeURIComponent(slug)}` : `/vehicles/${encodeURIComponent(slug)}?revision=${r.number}`;
          return (
            <li key={r.number} className={`rounded-lg border p-4 ${r.number === viewing ? "border-ink bg-paper-raised" : "border-line"}`}>
              <p className="flex flex-wrap items-baseline gap-x-3">
                <strong className="figures">Revision {r.number}</strong>
                <span>published {publishedText(r.publishedAt, dealership)}</span>
                {r.number === latest ? <span className="text-sm font-bold">· current</span> : null}
                {r.number === viewing ? <span className="text-sm font-bold">· you are reading this one</span> : null}
              </p>
              {r.changes.length ? (
                <ul className="mt-2 list-disc pl-5">
                  {r.changes.map((c, i) => (
                    <li key={i}>{c}</li>
                  ))}
                </ul>
              ) : null}
              {r.number !== viewing ? (
                <p className="mt-2 print:hidden">
                  <Link to={href}>{r.number === latest ? "Read the current report" : `Read revision ${r.number} as it was published`}</Link>
                </p>
              ) : null}
            </li>
          );
        })}
      </ol>
    </Section>
  );
}
