/** The desk's undo and redo stacks (see desk-history.ts), applied through the caller's edits. */
import { useCallback, useState } from "react";
import { EMPTY_HISTORY, recordChange, redoStep, undoStep, type DeskChange } from "./desk-history";

export function useDeskHistory(apply: (change: DeskChange, side: "before" | "after") => void) {
  const [history, setHistory] = useState(EMPTY_HISTORY);
  const record = useCallback(
    (change: DeskChange) => setHistory((h) => recordChange(h, change)),
    [],
  );
  const step = (which: "undo" | "redo") => {
    const next = which === "undo" ? undoStep(history) : redoStep(history);
    if (!next) return;
    setHistory(next.history);
    apply(next.change, which === "undo" ? "before" : "after");
  };
  return {
    record,
    undo: () => step("undo"),
    redo: () => step("redo"),
    canUndo: history.undo.length > 0,
    canRedo: history.redo.length > 0,
  };
}
