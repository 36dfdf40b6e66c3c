import { lazy, Suspense } from "react";

export interface EnquiryFormProps {
  slug: string;
  /** The revision number the buyer is reading; the lead records it. */
  revision: number;
  vehicleTitle: string;
  stockNumber: string;
  dealership: { name: string; phone: string; email: string };
}

// The form, its checks (zod and the shared schemas) and react-hook-form load after the condition page has drawn,
// so the report a buyer came to read never waits for them.
const Body = lazy(() => import("./EnquiryFormBody.tsx"));

/** The buyer's question about one vehicle (see EnquiryFormBody). */
export function EnquiryForm(props: EnquiryFormProps) {
  return (
    <Suspense fallback={<p className="min-h-96 text-ink-soft">Loading the form…</p>}>
      <Body {...props} />
    </Suspense>
  );
}
