import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";

/**
 * Every method's Tc side by side with its Monte Carlo band, the governing one marked, methods
 * outside their range flagged.
 */
export function MethodTotals({ sheet }: { sheet: TravelTimeSheet }) {
  const governing = sheet.governing?.method;
  return (
    <table className="w-full text-xs" aria-label="Tc by method">
      <thead>
        <tr className="text-left text-ink-600">
          <th scope="col" className="py-1 pr-2 font-semibold">
            Method
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-semibold">
            Tc (min)
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-semibold">
            Tc (h)
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-semibold">
            P10–P90 (min)
          </th>
          <th scope="col" className="py-1 font-semibold">
            Range and notes
          </th>
        </tr>
      </thead>
      <tbody>
        {sheet.methods.map((m) => {
          const outside = m.validity?.outside ?? [];
          return (
            <tr
              key={m.id}
              data-method={m.id}
              className={m.id === governing ? "bg-rill-50 font-semibold" : ""}
            >
              <th scope="row" data-label={m.label} className="py-1 pr-2 text-left font-medium">
                {m.label}
                {m.kind === "check" && <span className="ml-1 text-ink-500">(check)</span>}
                {m.id === governing && (
                  <span className="ml-1 rounded bg-rill-700 px-1 text-[10px] text-white">
                    governs
                  </span>
                )}
              </th>
              <td className="py-1 pr-2 text-right font-mono" data-total-min={m.id}>
                {m.totalMin === null ? "—" : m.totalMin.toFixed(2)}
              </td>
              <td className="py-1 pr-2 text-right font-mono">
                {m.totalHr === null ? "—" : m.totalHr.toFixed(3)}
              </td>
              <td className="py-1 pr-2 text-right font-mono whitespace-nowrap" data-band={m.id}>
                {m.band ? `${m.band.p10.toFixed(1)}–${m.band.p90.toFixed(1)}` : "—"}
              </td>
              <td className="py-1 text-ink-700">
                {m.status === "unavailable" ? (
                  <span className="text-ink-500">Not computed: {m.reason}</span>
                ) : outside.length > 0 ? (
                  <span className="text-caution-800">
                    ⚠ Outside its range ({m.validity?.range}): {outside.join("; ")}
                  </span>
                ) : (
                  <span className="text-ink-500">{m.validity?.range ?? ""}</span>
                )}
                {m.minimumApplied && <span className="ml-1 text-ink-500">minimum Tc applied</span>}
                {m.status === "ok" && m.scope === "overland" && (
                  <span className="ml-1 text-ink-500">
                    overland part only; no minimum Tc applied
                  </span>
                )}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
