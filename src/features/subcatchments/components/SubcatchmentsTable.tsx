import { Link } from "react-router-dom";
import { ftFromM } from "../../../../shared/hydrology/units";
import { type SubcatchmentListItem } from "../../../../shared/schemas/subcatchments";
import { linkClass } from "../../../components/link-styles";
import { TableHead } from "../../../components/TableHead";
import { MAP_DESK_AVAILABLE, mapDeskPath } from "../../../lib/project-outlet";

export type SubcatchmentState = "no-path" | "not-computed" | "computed" | "out-of-date";

/** Where a subcatchment stands: a result is out of date once its path version moved on. */
export function stateOf(s: SubcatchmentListItem): SubcatchmentState {
  if (!s.result) return s.flowPath ? "not-computed" : "no-path";
  return s.result.stale ? "out-of-date" : "computed";
}

const STATE_LABELS: Record<SubcatchmentState, { text: string; className: string }> = {
  "no-path": { text: "No flow path yet", className: "bg-ink-100 text-ink-700" },
  "not-computed": { text: "Not computed", className: "bg-ink-100 text-ink-700" },
  computed: { text: "Computed", className: "bg-rill-100 text-rill-900" },
  "out-of-date": { text: "Out of date", className: "bg-caution-100 text-caution-900" },
};

const COLUMNS = [
  { label: "Subcatchment" },
  { label: "Scenario" },
  { label: "Flow path" },
  { label: "Tc (governing)" },
  { label: "State" },
];

function TcCell({ result }: { result: SubcatchmentListItem["result"] }) {
  if (!result) return <span className="text-ink-500">—</span>;
  if (result.governingTcMin === null) {
    return (
      <span className="text-ink-600">
        No governing Tc{result.problem ? `: ${result.problem}` : ""}
      </span>
    );
  }
  return (
    <span>
      <span className="font-semibold text-ink-900 tabular-nums">
        {result.governingTcMin.toFixed(1)} min
      </span>
      <span className="block text-xs text-ink-500">{result.governingMethodLabel}</span>
    </span>
  );
}

export function SubcatchmentsTable({
  projectId,
  subcatchments,
}: {
  projectId: string;
  subcatchments: readonly SubcatchmentListItem[];
}) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">Subcatchments of the project</caption>
      <TableHead columns={COLUMNS} />
      <tbody className="divide-y divide-ink-100">
        {subcatchments.map((s) => {
          const state = stateOf(s);
          const label = STATE_LABELS[state];
          return (
            <tr key={s.id} className="align-top">
              <td className="py-3 pr-4 font-medium text-ink-900">
                {MAP_DESK_AVAILABLE ? (
                  <Link to={mapDeskPath(projectId, s.id)} className={linkClass}>
                    {s.name}
                  </Link>
                ) : (
                  s.name
                )}
              </td>
              <td className="py-3 pr-4 text-ink-700 capitalize">{s.scenario}</td>
              <td className="py-3 pr-4 text-ink-700 tabular-nums">
                {s.flowPath
                  ? `${(s.lengthUnit === "ft" ? ftFromM(s.flowPath.lengthM) : s.flowPath.lengthM).toFixed(0)} ${s.lengthUnit}`
                  : "—"}
              </td>
              <td className="py-3 pr-4">
                <TcCell result={s.result} />
              </td>
              <td className="py-3">
                <span className={`rounded-sm px-1.5 py-0.5 text-xs font-medium ${label.className}`}>
                  {label.text}
                </span>
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
