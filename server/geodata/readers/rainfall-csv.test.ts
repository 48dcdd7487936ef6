// Rainfall CSV: layout, header forms, and errors that name the row and column.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { readRainfallCsv } from "./rainfall-csv";
import { fixture, readErrorOf } from "./test-support";

const csv = (...lines: string[]) => lines.join("\n");

describe("rainfall CSV reader", () => {
  it("reads durations × return periods as an intensity table, comments as notes", () => {
    const { idf, notes } = readRainfallCsv(
      readFileSync(fixture("rainfall.csv"), "utf8"),
      "idf.csv",
    );
    expect(idf).toMatchObject({
      kind: "table",
      durationsMin: [5, 10, 15, 30, 60],
      returnPeriodsYears: [2, 10, 25, 100],
    });
    expect(idf.kind === "table" && idf.intensity?.[0]).toEqual([4.9, 6.6, 7.6, 9.2]);
    expect(notes[0]).toEqual({
      where: "row 1",
      message: "Invented rainfall for tests; not the record of any place",
    });
  });

  it.each(["2", "2-yr", "2 yr", "2-year", "T=2", "T2"])(
    "accepts the return period header %s",
    (header) => {
      const { idf } = readRainfallCsv(
        csv(`duration_min,${header}`, "5,1.2", "10,1.5"),
        "d.csv",
        "depth",
      );
      expect(idf.kind === "table" && idf.returnPeriodsYears).toEqual([2]);
    },
  );

  it("stores durations given in hours as minutes, noting it", () => {
    const { idf, notes } = readRainfallCsv(
      csv("duration_hr,10-yr", "1,2.1", "24,6.0"),
      "d.csv",
      "depth",
    );
    expect(idf.kind === "table" && idf.durationsMin).toEqual([60, 1440]);
    expect(notes).toContainEqual({
      where: "row 1",
      message: "durations given in hours; stored in minutes",
    });
  });

  it("names the row and column of a missing cell", async () => {
    const text = readFileSync(fixture("rainfall-missing-cell.csv"), "utf8");
    const error = await readErrorOf(() => readRainfallCsv(text, "idf.csv"));
    expect([error.status, error.message]).toEqual([
      422,
      'idf.csv, row 5, column "10-yr": is empty; every cell needs a value',
    ]);
  });

  it("names the row and column of a value that is not a number", async () => {
    const error = await readErrorOf(() =>
      readRainfallCsv(csv("duration_min,2", "5,abc", "10,1"), "d.csv", "intensity"),
    );
    expect(error.message).toBe('d.csv, row 2, column "2": "abc" is not a number');
  });

  it("translates the engineering core's monotonicity finding to the row and column", async () => {
    const error = await readErrorOf(() =>
      readRainfallCsv(csv("duration_min,2,10", "5,4,5", "10,4.5,4"), "d.csv", "intensity"),
    );
    expect(error.message).toBe(
      'd.csv, row 3, column "2": intensity 4.5 at 10 min is above 4 at 5 min (2-year); intensity must not rise with duration',
    );
  });

  it("refuses durations that do not increase, naming the duration column", async () => {
    const error = await readErrorOf(() =>
      readRainfallCsv(csv("duration_min,2", "10,4", "5,5"), "d.csv", "intensity"),
    );
    expect(error.message).toBe(
      'd.csv, row 3, column "duration_min": durations must increase strictly',
    );
  });

  it("asks whether the values are intensity or depth when nothing says so", async () => {
    const error = await readErrorOf(() =>
      readRainfallCsv(csv("duration_min,2", "5,4", "10,3"), "d.csv"),
    );
    expect(error.message).toMatch(/^d\.csv, row 1: say whether the values are intensity or depth/);
  });

  it("refuses a header and an upload that disagree on the kind", async () => {
    const error = await readErrorOf(() =>
      readRainfallCsv(csv("duration_min depth,2", "5,4", "10,5"), "d.csv", "intensity"),
    );
    expect(error.message).toBe(
      "d.csv, row 1: the first header says depth but the upload says intensity",
    );
  });
});
