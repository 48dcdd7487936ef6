import { Fragment, useState } from "react";
import { Button } from "../../../components/Button";
import { type SurfaceClass } from "../../../lib/surface-classes";

const n = (v: number | null | undefined) => (v === null || v === undefined ? "—" : String(v));

const HEADINGS = [
  "Class",
  "n (sheet)",
  "k velocity (ft/s)",
  "k TR-55 (ft/s)",
  "Kerby N",
  "CN A",
  "CN B",
  "CN C",
  "CN D",
  "C low",
  "C design",
  "C high",
];

function Sources({ cls }: { cls: SurfaceClass }) {
  const v = cls.values;
  const rows: Array<[string, string | undefined]> = [
    ["Manning's n, sheet flow", v.sheetFlowN?.source],
    ["k, velocity method", v.velocityKFtPerS?.source],
    ["k, TR-55 shallow flow", v.shallowKFtPerS?.source],
    ["Kerby N", v.kerbyN?.source],
    ["Curve numbers", v.cn.source],
    ["Runoff coefficient C", v.runoffC?.source],
  ];
  return (
    <dl className="grid grid-cols-[12rem_1fr] gap-x-4 gap-y-1 text-xs">
      {rows.map(([label, source]) => (
        <Fragment key={label}>
          <dt className="text-ink-500">{label}</dt>
          <dd className="text-ink-800">{source ?? "not given"}</dd>
        </Fragment>
      ))}
    </dl>
  );
}

/** Every class with its numbers; each row opens to show where every number comes from. */
export function CatalogTable({
  classes,
  mayEdit,
  onEdit,
}: {
  classes: readonly SurfaceClass[];
  mayEdit: boolean;
  onEdit: (cls: SurfaceClass) => void;
}) {
  const [open, setOpen] = useState<Set<string>>(new Set());
  const toggle = (id: string) =>
    setOpen((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm tabular-nums">
        <caption className="sr-only">Surface catalog classes</caption>
        <thead className="border-b border-ink-200 text-xs text-ink-500">
          <tr>
            {HEADINGS.map((h) => (
              <th key={h} scope="col" className="py-2 pr-3 font-semibold whitespace-nowrap">
                {h}
              </th>
            ))}
            <th scope="col" className="py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {classes.map((cls) => {
            const v = cls.values;
            const expanded = open.has(cls.id);
            return (
              <Fragment key={cls.id}>
                <tr className="align-top">
                  <th scope="row" className="py-2 pr-3 text-left font-medium text-ink-900">
                    <span className="flex items-center gap-2">
                      <span
                        aria-hidden="true"
                        className="inline-block size-4 shrink-0 rounded-sm border border-ink-300"
                        style={{ backgroundColor: v.colour }}
                      />
                      {cls.name}
                    </span>
                    <span className="block text-xs font-normal text-ink-500">{cls.key}</span>
                  </th>
                  <td className="py-2 pr-3">{n(v.sheetFlowN?.value)}</td>
                  <td className="py-2 pr-3">{n(v.velocityKFtPerS?.value)}</td>
                  <td className="py-2 pr-3">{n(v.shallowKFtPerS?.value)}</td>
                  <td className="py-2 pr-3">{n(v.kerbyN?.value)}</td>
                  <td className="py-2 pr-3">{n(v.cn.A)}</td>
                  <td className="py-2 pr-3">{n(v.cn.B)}</td>
                  <td className="py-2 pr-3">{n(v.cn.C)}</td>
                  <td className="py-2 pr-3">{n(v.cn.D)}</td>
                  <td className="py-2 pr-3">{n(v.runoffC?.low)}</td>
                  <td className="py-2 pr-3">{n(v.runoffC?.design)}</td>
                  <td className="py-2 pr-3">{n(v.runoffC?.high)}</td>
                  <td className="py-2 whitespace-nowrap">
                    <Button
                      variant="quiet"
                      size="sm"
                      aria-expanded={expanded}
                      aria-controls={`sources-${cls.id}`}
                      onClick={() => toggle(cls.id)}
                      aria-label={`Sources of ${cls.name}`}
                    >
                      Sources
                    </Button>
                    {mayEdit && (
                      <Button
                        variant="quiet"
                        size="sm"
                        onClick={() => onEdit(cls)}
                        aria-label={`Edit ${cls.name}`}
                      >
                        Edit
                      </Button>
                    )}
                  </td>
                </tr>
                <tr id={`sources-${cls.id}`} hidden={!expanded}>
                  <td colSpan={HEADINGS.length + 1} className="bg-paper/60 px-3 py-2">
                    <Sources cls={cls} />
                  </td>
                </tr>
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
