import { useState } from "react";
import { useFeeds } from "../../features/feeds/api/feeds.ts";
import { FeedCard } from "../../features/feeds/components/FeedCard.tsx";
import { FeedForm } from "../../features/feeds/components/FeedForm.tsx";
import { SecretUrl } from "../../features/feeds/components/SecretUrl.tsx";
import { PageHeader, Panel } from "../../components/ui/Page.tsx";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";

/** Guarded by its action in app/router.tsx. */
export default function FeedsPage() {
  const feeds = useFeeds();
  const [secret, setSecret] = useState<string | null>(null);
  return (
    <>
      <PageHeader title="Feeds" lead="Stock for portals and marketing tools, from published revisions only. Each feed has a secret URL; a portal can ask for changes since its last visit." />
      <div className="flex flex-col gap-8">
        {secret ? <SecretUrl url={secret} onDone={() => setSecret(null)} /> : null}
        <section aria-label="Feeds" className="flex flex-col gap-4">
          {feeds.isPending ? (
            <Loading />
          ) : feeds.isError ? (
            <Notice tone="danger" title={feeds.error.message} />
          ) : feeds.data.feeds.length ? (
            feeds.data.feeds.map((f) => <FeedCard key={f.id} feed={f} onSecret={setSecret} />)
          ) : (
            <EmptyState title="No feeds yet">Create one below; preview its first rows before you save it.</EmptyState>
          )}
        </section>
        <Panel title="Create a feed">
          <FeedForm onCreated={(url) => { setSecret(url); window.scrollTo({ top: 0 }); }} />
        </Panel>
      </div>
    </>
  );
}
