/**
 * Typed domain errors of the engineering core. A HydrologyError is bad input or a request the
 * data cannot answer (a duration outside the IDF table); it names the field path the way a user
 * would write it (`segments[2].slope`) and says what is wanted. Broken invariants are bugs and
 * throw a plain Error through `invariant`.
 */

export type HydrologyErrorCode =
  /** A field is missing, of the wrong type, or out of its allowed range. */
  | "invalid-input"
  /** A duration or return period outside the rainfall data, with extrapolation not allowed. */
  | "idf-out-of-range"
  /** A solver could not meet its tolerance (never expected for valid input). */
  | "no-convergence";

export interface FieldProblem {
  readonly path: string;
  readonly message: string;
}

export interface HydrologyErrorJson {
  readonly error: {
    readonly code: HydrologyErrorCode;
    readonly message: string;
    readonly fields?: readonly FieldProblem[];
  };
}

export class HydrologyError extends Error {
  override readonly name = "HydrologyError";
  readonly code: HydrologyErrorCode;
  /** Path of the first offending field ("" when the whole input is at fault). */
  readonly path: string;
  /** Every offending field, first one first. */
  readonly fields: readonly FieldProblem[];

  constructor(code: HydrologyErrorCode, path: string, message: string, fields?: FieldProblem[]) {
    super(path === "" ? message : `${path}: ${message}`);
    this.code = code;
    this.path = path;
    this.fields = fields && fields.length > 0 ? fields : [{ path, message }];
  }

  /** The project's error JSON shape, `{ error: { code, message, fields } }`. */
  toJSON(): HydrologyErrorJson {
    return { error: { code: this.code, message: this.message, fields: this.fields } };
  }
}

export function isHydrologyError(value: unknown): value is HydrologyError {
  return value instanceof HydrologyError;
}

/** `["segments", 2, "slope"]` → `segments[2].slope`. */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = "";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out;
}

/** Asserts an invariant of the code itself; failing means a bug, not bad input. */
export function invariant(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(`Rillmark invariant failed: ${message}`);
}

/** Guards every number that leaves the core: a result is never NaN or Infinity. */
export function finite(value: number, what: string): number {
  invariant(Number.isFinite(value), `${what} is not finite (${value})`);
  return value;
}
