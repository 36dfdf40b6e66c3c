import type { PublicSnapshot } from "../../../../../shared/schemas/public.ts";
import { NOT_A_CERTIFICATE } from "../../../../../shared/domain/cautions.ts";
import { dateText, publishedText } from "../../format.ts";
import { Section } from "./Section.tsx";

interface Props {
  snapshot: PublicSnapshot;
  revision: number;
  publishedAt: string;
  locale: string;
}

/** The usual cautions (PRODUCT.md, TRADE.md §8): what the report is, what it is not, and what the buyer should do. */
export function AboutReport({ snapshot: s, revision, publishedAt, locale }: Props) {
  const inspected = dateText(s.inspectedOn, locale);
  const published = <>This is revision {revision} of the report, published on {publishedText(publishedAt, s.dealership)}</>;
  return (
    <Section id="about-report" title="About this report">
      <div className="fr-about flex max-w-prose flex-col gap-3">
        {/* The top of the printed report already says this. */}
        <p className="print:hidden">
          {published}
          {inspected ? <>, from the inspection on {inspected}</> : null}
          {s.inspectedBy ? <> by {s.inspectedBy}</> : null}. A published revision is never changed afterwards.
        </p>
        <p className="font-bold">{NOT_A_CERTIFICATE}</p>
        <p>
          <strong>Have it inspected independently before you buy.</strong> A mechanic or inspection service you choose can check what a
          walk-around cannot see. We are happy to arrange a time for it.
        </p>
        <p>
          The legal thresholds shown here, such as the minimum tread depth and tyre age advice, are for information. Local law and a licensed inspector decide.
          The odometer figure is the reading on the instrument at the inspection.
        </p>
        {s.disclaimerHtml ? (
          <div className="break-inside-avoid border-l-4 border-line-strong pl-3">
            <p className="text-sm font-bold">In the dealership’s own words</p>
            <div className="prose-copy" dangerouslySetInnerHTML={{ __html: s.disclaimerHtml }} />
          </div>
        ) : null}
      </div>
    </Section>
  );
}
