/**
 * Reading the class dialog: every input is named by its path in the API body
 * ("values.sheetFlowN.value"), so the schema's and the server's messages land on their input.
 * An empty value means "not given" (null), as the published tables leave some cells blank.
 */
import { type CreateSurfaceClassBody } from "../../../../shared/schemas/catalog";
import { type SurfaceClass } from "../../../lib/surface-classes";

type Values = SurfaceClass["values"];

const str = (data: FormData, name: string) => String(data.get(name) ?? "").trim();
const num = (data: FormData, name: string): number | null => {
  const s = str(data, name);
  return s === "" ? null : Number(s);
};

export const SOURCED = [
  { key: "sheetFlowN", label: "Manning's n, sheet flow", unit: "" },
  { key: "velocityKFtPerS", label: "k, velocity method", unit: "ft/s" },
  { key: "shallowKFtPerS", label: "k, TR-55 shallow flow", unit: "ft/s" },
  { key: "kerbyN", label: "Kerby N", unit: "" },
] as const;

export function bodyFromForm(data: FormData, current: SurfaceClass | null): CreateSurfaceClassBody {
  const values: Record<string, unknown> = {};
  for (const { key } of SOURCED) {
    const value = num(data, `values.${key}.value`);
    const old = current?.values[key];
    values[key] =
      value === null
        ? null
        : {
            value,
            source: str(data, `values.${key}.source`),
            note: old?.note ?? "",
            rowId: old?.rowId ?? null,
          };
  }
  values.cn = {
    A: num(data, "values.cn.A"),
    B: num(data, "values.cn.B"),
    C: num(data, "values.cn.C"),
    D: num(data, "values.cn.D"),
    source: str(data, "values.cn.source"),
    note: current?.values.cn.note ?? "",
    rowId: current?.values.cn.rowId ?? null,
  };
  const low = num(data, "values.runoffC.low");
  const design = num(data, "values.runoffC.design");
  const high = num(data, "values.runoffC.high");
  values.runoffC =
    low === null && design === null && high === null
      ? null
      : {
          low: low ?? Number.NaN,
          design: design ?? Number.NaN,
          high: high ?? Number.NaN,
          source: str(data, "values.runoffC.source"),
          note: current?.values.runoffC?.note ?? "",
          rowId: current?.values.runoffC?.rowId ?? null,
        };
  values.colour = str(data, "values.colour").toLowerCase();
  return {
    key: current?.key ?? str(data, "key"),
    name: str(data, "name"),
    description: str(data, "description"),
    values: values as Values,
  };
}

/** Text for an input's default value. */
export const shown = (n: number | null | undefined) =>
  n === null || n === undefined ? "" : String(n);
