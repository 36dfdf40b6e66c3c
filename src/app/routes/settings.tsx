import { useDealership } from "../../features/settings/api/dealership.ts";
import { SettingsForm } from "../../features/settings/components/SettingsForm.tsx";
import { PageHeader } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

/** Guarded by its action in app/router.tsx. */
export default function SettingsPage() {
  const q = useDealership();
  return (
    <>
      <PageHeader title="Dealership" lead="What buyers see about you, and the rules of your market that Forthright applies to every vehicle." />
      {q.isPending ? <Loading /> : q.isError ? <Notice tone="danger" title={q.error.message} /> : <SettingsForm key={q.data.dealership.version} dealership={q.data.dealership} />}
    </>
  );
}
