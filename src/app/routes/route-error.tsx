import { isRouteErrorResponse, useRouteError } from "react-router";

export function RouteError() {
  const error = useRouteError();
  const chunkFailed = error instanceof Error && /dynamically imported module|Failed to fetch/i.test(error.message);
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <h1 className="text-2xl font-bold">This page could not be shown</h1>
      <p className="mt-3 text-ink-soft">
        {chunkFailed
          ? "Forthright was updated or the connection dropped while the page loaded. Reload to get the latest version."
          : isRouteErrorResponse(error)
            ? `${error.status} ${error.statusText}`
            : "Something unexpected went wrong. Reload the page; if it happens again, tell your admin what you were doing."}
      </p>
      <button className="mt-6 min-h-11 rounded-md bg-signal px-4 font-bold text-paper-raised" onClick={() => location.reload()}>
        Reload
      </button>
    </main>
  );
}
