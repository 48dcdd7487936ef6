import { describe, expect, it } from "vitest";
import { breaksForRegime } from "./regime-edit";

// Regimes run sheet → shallow concentrated → channel from the divide (TR-55, 1986, chapter 3),
// so each change of one segment's regime is a move of the break beside it.
describe("regime cell edits as break moves", () => {
  const seg = (regime: "sheet" | "shallow" | "channel") => ({
    stationFrom: 100,
    stationTo: 250,
    regime,
  });

  it("extends sheet flow to the end of a shallow segment", () => {
    expect(breaksForRegime(seg("shallow"), "sheet")).toEqual({ sheetEnd: 250 });
  });

  it("starts channel flow at the top of a shallow segment", () => {
    expect(breaksForRegime(seg("shallow"), "channel")).toEqual({ channelStart: 100 });
  });

  it("ends sheet flow at the top of a sheet segment made shallow", () => {
    expect(breaksForRegime(seg("sheet"), "shallow")).toEqual({ sheetEnd: 100 });
  });

  it("moves channel flow down past a channel segment made shallow", () => {
    expect(breaksForRegime(seg("channel"), "shallow")).toEqual({ channelStart: 250 });
  });

  it("changes nothing when the regime stays", () => {
    expect(breaksForRegime(seg("sheet"), "sheet")).toBeNull();
  });
});
