import { Link } from "react-router";
import { useStaffUser } from "../RequireAction.tsx";
import { navFor } from "../nav.ts";
import { PageHeader, Panel } from "../../components/ui/Page.tsx";
import { ROLE_LABELS } from "../../../shared/constants/roles.ts";

export default function StaffOverview() {
  const user = useStaffUser();
  const first = user.name.split(" ")[0];
  const places = navFor(user).filter((n) => n.to !== "/app");
  return (
    <>
      <PageHeader title={`Hello, ${first}`} lead={`Signed in as ${ROLE_LABELS[user.role].label.toLowerCase()}. ${ROLE_LABELS[user.role].summary}`} />
      <div className="grid gap-4 md:grid-cols-2">
        {places.map((p) => (
          <Panel key={p.to} title={<Link to={p.to}>{p.label}</Link>}>
            <p className="text-ink-soft">{DESCRIPTIONS[p.to] ?? ""}</p>
          </Panel>
        ))}
        <Panel title={<a href="/">Public site</a>}>
          <p className="text-ink-soft">What buyers see: the dealership's live stock and each vehicle's condition page.</p>
        </Panel>
      </div>
    </>
  );
}

const DESCRIPTIONS: Record<string, string> = {
  "/app/vehicles": "Every vehicle on the books: search, filter, open a record, move it along.",
  "/app/users": "Invite staff, change roles, and deactivate accounts.",
  "/app/leads": "Buyers' enquiries: who asked about which vehicle, and where each conversation stands.",
  "/app/feeds": "Live stock for portals and partner sites: CSV, JSON, XML and schema.org, at secret addresses.",
  "/app/mail": "Mail going out, and what the demo's mail catcher received.",
  "/app/settings": "Name, address, licence number, market rules and publishing rules.",
};
