import type { ReactNode } from "react";
import { Link } from "react-router";
import { Wordmark } from "../../components/ui/Page.tsx";

/** The frame of the public account pages, as the sign-in page has it. */
export function PublicFrame({ title, lead, children }: { title: ReactNode; lead?: ReactNode; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-5 py-10">
      <Link to="/sign-in" className="self-start text-ink no-underline" aria-label="Forthright staff sign-in">
        <Wordmark className="text-2xl" />
      </Link>
      <h1 className="mt-8 text-3xl font-bold">{title}</h1>
      {lead ? <p className="mt-2 text-ink-soft">{lead}</p> : null}
      <div className="mt-8">{children}</div>
    </main>
  );
}
