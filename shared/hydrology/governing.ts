/**
 * Which Tc governs: the method the design rules name, or the largest or smallest Tc of the
 * computed methods (checks only when no method could be computed). A named method that cannot
 * be computed falls back to the smallest Tc — the conservative choice for peak flow, since a
 * shorter Tc reads a higher intensity — and says so in a warning.
 */
import { CHECK_METHOD_IDS, METHOD_LABELS, TC_METHOD_IDS, type MethodId } from "./method-ids";
import type { Governing, MethodOk, MethodResults } from "./result-types";
import type { GoverningChoice } from "./rules";
import { hrFromMin } from "./units";
import type { WarningList } from "./warnings";

function computed(methods: MethodResults, ids: readonly MethodId[]): MethodOk[] {
  const out: MethodOk[] = [];
  for (const id of ids) {
    const m = methods[id];
    if (m.status === "ok") out.push(m);
  }
  return out;
}

function extreme(methods: MethodResults, pick: "largest" | "smallest", why: string): Governing {
  let candidates = computed(methods, TC_METHOD_IDS);
  if (candidates.length === 0) candidates = computed(methods, CHECK_METHOD_IDS);
  const [first, ...rest] = candidates;
  if (first === undefined) throw new Error("Rillmark invariant failed: no method computed a Tc");
  let best = first;
  for (const m of rest) {
    if (pick === "largest" ? m.totalMin > best.totalMin : m.totalMin < best.totalMin) best = m;
  }
  const list = candidates.map((m) => `${m.id} ${m.totalMin.toFixed(2)} min`).join(", ");
  return {
    method: best.id,
    tcMin: best.totalMin,
    tcHr: hrFromMin(best.totalMin),
    reason: `${why}: ${pick} Tc of ${list}`,
  };
}

export function chooseGoverning(
  methods: MethodResults,
  choice: GoverningChoice,
  warnings: WarningList,
  minTcMin: number,
): Governing {
  if (choice === "largest" || choice === "smallest") {
    return extreme(methods, choice, `rules.governing is "${choice}"`);
  }
  const named = methods[choice];
  if (named.status === "ok" && named.scope === "overland") {
    // An overland-only check does not carry the minimum Tc itself; the governing Tc does.
    const tcMin = Math.max(named.totalMin, minTcMin);
    return {
      method: choice,
      tcMin,
      tcHr: hrFromMin(tcMin),
      reason:
        `${METHOD_LABELS[choice]} governs by the design rules (rules.governing = "${choice}"); ` +
        "it estimates the overland part of the path only" +
        (tcMin > named.totalMin ? `, and the minimum Tc of ${minTcMin} min applies` : ""),
    };
  }
  if (named.status === "ok") {
    return {
      method: choice,
      tcMin: named.totalMin,
      tcHr: named.totalHr,
      reason: `${METHOD_LABELS[choice]} governs by the design rules (rules.governing = "${choice}")`,
    };
  }
  warnings.add({
    code: "governing-unavailable",
    method: choice,
    message:
      `rules.governing names the ${METHOD_LABELS[choice]}, which could not be computed ` +
      `(${named.reason}); the smallest Tc of the other methods governs instead`,
  });
  return extreme(methods, "smallest", `${choice} could not be computed`);
}
