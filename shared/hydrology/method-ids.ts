/**
 * Method ids (the published names, kept stable: the command line, the API and saved sheets use
 * them) and their labels. The first four compute a time of concentration; the rest are labelled
 * checks.
 */

export const TC_METHOD_IDS = ["velocity", "nrcs-lag", "kinematic-wave", "nrcs-segmental"] as const;
export const CHECK_METHOD_IDS = ["kirpich", "kerby", "faa", "kerby-kirpich"] as const;
export const METHOD_IDS = [...TC_METHOD_IDS, ...CHECK_METHOD_IDS] as const;

export type TcMethodId = (typeof TC_METHOD_IDS)[number];
export type CheckMethodId = (typeof CHECK_METHOD_IDS)[number];
export type MethodId = (typeof METHOD_IDS)[number];

export const METHOD_LABELS: Readonly<Record<MethodId, string>> = {
  velocity: "Velocity method",
  "nrcs-lag": "NRCS lag (curve number) method",
  "kinematic-wave": "Kinematic-wave overland flow",
  "nrcs-segmental": "NRCS segmental method (TR-55)",
  kirpich: "Kirpich check",
  kerby: "Kerby check",
  faa: "FAA check",
  "kerby-kirpich": "Kerby–Kirpich check",
};

export function isCheckMethod(id: MethodId): id is CheckMethodId {
  return (CHECK_METHOD_IDS as readonly string[]).includes(id);
}
