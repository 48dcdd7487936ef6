/**
 * Turns zod issues into field problems a drainage engineer can act on: the path as they would
 * write it (`segments[2].slope`), and what is wanted, in plain words.
 */
import type { z } from "zod";
import { formatPath, HydrologyError, type FieldProblem } from "./errors";

type Issue = z.core.$ZodIssue;

function describe(issue: Issue): FieldProblem[] {
  const path = formatPath(issue.path);
  switch (issue.code) {
    case "unrecognized_keys":
      return issue.keys.map((key) => ({
        path: formatPath([...issue.path, key]),
        message: "is not a known field (check the spelling; see docs/calc-format.md)",
      }));
    case "invalid_type": {
      const missing = /received undefined|^is required/.test(issue.message);
      return [
        {
          path,
          message: missing ? `is required (a ${issue.expected})` : `must be a ${issue.expected}`,
        },
      ];
    }
    case "too_small":
    case "too_big":
    case "custom":
    case "invalid_value":
    case "invalid_union":
    case "invalid_format":
    default:
      return [{ path, message: issue.message }];
  }
}

export function fieldProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.flatMap(describe);
}

/** The typed error for a failed parse: code invalid-input, first field first. */
export function inputError(error: z.ZodError): HydrologyError {
  const fields = fieldProblems(error);
  const first = fields[0] ?? { path: "", message: "is not valid input" };
  const more = fields.length > 1 ? ` (and ${fields.length - 1} more)` : "";
  return new HydrologyError("invalid-input", first.path, `${first.message}${more}`, fields);
}
