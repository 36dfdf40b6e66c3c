import { Link } from "react-router";
import type { LeadStats } from "../api/leads.ts";
import { Panel } from "../../../components/ui/Page.tsx";
import { EmptyState } from "../../../components/feedback/Notice.tsx";
import { SOURCE_LABELS } from "../format.ts";
import { cell as th, TableHead } from "../../../components/ui/DataTable.tsx";

/** Counts only: which vehicles draw questions and from where. No buyer's name or address appears here. */
export function LeadStatsView({ stats }: { stats: LeadStats }) {
  const total = stats.perSource.reduce((n, s) => n + s.n, 0);
  if (!total) return <EmptyState title="No enquiries yet">When buyers ask about a vehicle from its condition page, the counts appear here.</EmptyState>;
  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <Panel title="Enquiries per vehicle">
        <table className="w-full text-left text-sm">
          <TableHead columns={[{ label: "Vehicle" }, { label: "Stock no." }, { label: "Enquiries", end: true }]} sunk={false} />
          <tbody>
            {stats.perVehicle.map((v) => (
              <tr key={v.vehicleId} className="border-b border-line last:border-0">
                <th scope="row" className={`${th} font-normal`}>
                  <Link to={`/app/vehicles/${v.vehicleId}`}>{v.title ?? `Vehicle ${v.stockNumber}`}</Link>
                </th>
                <td className={`${th} font-mono`}>{v.stockNumber}</td>
                <td className={`${th} figures text-right font-bold`}>{v.n}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Panel>
      <Panel title="Enquiries per source">
        <table className="w-full text-left text-sm">
          <TableHead columns={[{ label: "Source" }, { label: "Enquiries", end: true }]} sunk={false} />
          <tbody>
            {stats.perSource.map((s) => (
              <tr key={s.source} className="border-b border-line last:border-0">
                <th scope="row" className={`${th} font-normal`}>{SOURCE_LABELS[s.source] ?? s.source}</th>
                <td className={`${th} figures text-right font-bold`}>{s.n}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr>
              <th scope="row" className={th}>All sources</th>
              <td className={`${th} figures text-right font-bold`}>{total}</td>
            </tr>
          </tfoot>
        </table>
      </Panel>
    </div>
  );
}
