import { type Layer } from "../../../../shared/schemas/layers";
import { Button } from "../../../components/Button";
import { TableHead } from "../../../components/TableHead";
import { formatDate } from "../../../lib/format";
import { KIND_LABELS } from "./UploadLayerForm";

const STATUS: Record<Layer["status"], { text: string; className: string }> = {
  queued: { text: "Waiting", className: "bg-ink-100 text-ink-700" },
  processing: { text: "Processing", className: "bg-rill-50 text-rill-800" },
  ready: { text: "Ready", className: "bg-rill-100 text-rill-900" },
  failed: { text: "Failed", className: "bg-brick-100 text-brick-700" },
};

const COLUMNS = [
  { label: "Layer" },
  { label: "Kind" },
  { label: "Status" },
  { label: "Features" },
  { label: "Notes and problems" },
  { label: "Actions", hidden: true },
];

function Findings({ layer }: { layer: Layer }) {
  if (layer.status === "failed" && layer.error) {
    return (
      <p className="text-brick-700">
        {layer.error.message}
        {layer.error.where ? ` (${layer.error.where})` : ""}
      </p>
    );
  }
  if (layer.problems.length === 0 && layer.notes.length === 0) {
    return <span className="text-ink-500">—</span>;
  }
  return (
    <ul className="space-y-1">
      {layer.problems.map((p, i) => (
        <li key={`p${i}`} className="text-caution-900">
          <span className="mr-1 rounded-sm bg-caution-100 px-1 text-xs font-medium">To do</span>
          {p.message}
          {p.values.length > 0 && (
            <span className="block text-xs text-ink-600">
              Not mapped: {p.values.map((v) => (v === "" ? "(empty)" : v)).join(", ")} —{" "}
              {p.featureCount.toLocaleString()} features
            </span>
          )}
        </li>
      ))}
      {layer.notes.slice(0, 5).map((n, i) => (
        <li key={`n${i}`} className="text-xs text-ink-600">
          {n.where}: {n.message}
        </li>
      ))}
      {layer.notes.length > 5 && (
        <li className="text-xs text-ink-500">and {layer.notes.length - 5} more notes</li>
      )}
    </ul>
  );
}

interface LayersTableProps {
  layers: readonly Layer[];
  mayEdit: boolean;
  onMap: (layer: Layer) => void;
  onDelete: (layer: Layer) => void;
}

export function LayersTable({ layers, mayEdit, onMap, onDelete }: LayersTableProps) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">Layers of the project</caption>
      <TableHead columns={COLUMNS} />
      <tbody className="divide-y divide-ink-100">
        {layers.map((layer) => {
          const status = STATUS[layer.status];
          const mappable =
            (layer.kind === "cover" || layer.kind === "soil") && layer.status === "ready";
          return (
            <tr key={layer.id} className="align-top">
              <td className="py-3 pr-4">
                <span className="font-medium text-ink-900">{layer.name}</span>
                <span className="block text-xs text-ink-500">
                  {layer.originalFilename} · {layer.format} · {formatDate(layer.createdAt)}
                </span>
              </td>
              <td className="py-3 pr-4 whitespace-nowrap text-ink-700">
                {KIND_LABELS[layer.kind]}
              </td>
              <td className="py-3 pr-4">
                <span
                  className={`rounded-sm px-1.5 py-0.5 text-xs font-medium ${status.className}`}
                >
                  {status.text}
                </span>
              </td>
              <td className="py-3 pr-4 text-ink-700 tabular-nums">
                {layer.kind === "terrain" ? "—" : layer.featureCount.toLocaleString()}
              </td>
              <td className="py-3 pr-4">
                <Findings layer={layer} />
              </td>
              <td className="py-3 text-right whitespace-nowrap">
                {mappable && (
                  <Button
                    variant="quiet"
                    size="sm"
                    onClick={() => onMap(layer)}
                    aria-label={`${mayEdit ? "Map values of" : "Show mapping of"} ${layer.name}`}
                  >
                    {mayEdit ? "Map values" : "Mapping"}
                  </Button>
                )}
                {mayEdit && (
                  <Button
                    variant="quiet"
                    size="sm"
                    onClick={() => onDelete(layer)}
                    aria-label={`Delete ${layer.name}`}
                  >
                    Delete
                  </Button>
                )}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
