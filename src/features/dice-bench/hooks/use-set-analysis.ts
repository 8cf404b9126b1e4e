import { useDeferredValue, useMemo } from "react";
import { analyzeSet, dieFacesSchema, SET_SIZE_MAX, type SetAnalysis } from "@shared/probability/index";

/** A die as the bench shows it: name, faces, colour and pattern. */
export type BenchDie = { name: string; faces: number[]; colour: string; pattern: string };

/** Form values while the teacher types: any part may be missing or wrong. */
export type DraftDie = { name?: unknown; faces?: unknown; colour?: unknown; pattern?: unknown };

/** The dice of a draft that can be analysed now: named, with valid faces, each name once (later repeats are left out). */
export function usableDice(draft: readonly DraftDie[] | undefined): BenchDie[] {
  const seen = new Set<string>();
  const usable: BenchDie[] = [];
  for (const die of draft ?? []) {
    const name = typeof die.name === "string" ? die.name.trim() : "";
    const faces = dieFacesSchema.safeParse(die.faces);
    if (name === "" || !faces.success || seen.has(name.toLowerCase())) continue;
    seen.add(name.toLowerCase());
    usable.push({ name, faces: faces.data, colour: String(die.colour ?? "teal"), pattern: String(die.pattern ?? "dots") });
  }
  return usable;
}

export type SetAnalysisState = {
  /** The dice the analysis covers (the valid part of the draft). */
  dice: BenchDie[];
  /** How many dice of the draft were left out because they are not valid yet. */
  leftOut: number;
  analysis: SetAnalysis | null;
  /** True while the shown analysis is behind what the teacher has typed (React is still catching up). */
  isStale: boolean;
};

/**
 * Exact analysis of the valid part of a draft set, recomputed as the teacher types.
 * The draft is deferred so typing stays responsive; the analysis is memoised on the dice themselves.
 */
export function useSetAnalysis(draft: readonly DraftDie[] | undefined): SetAnalysisState {
  const deferred = useDeferredValue(draft);
  const key = useMemo(() => JSON.stringify(usableDice(deferred).slice(0, SET_SIZE_MAX)), [deferred]);
  // Keyed on the dice's text, so an edit that changes nothing (or only an invalid die) reuses the last analysis.
  const { dice, analysis } = useMemo(() => {
    const parsed = JSON.parse(key) as BenchDie[];
    return { dice: parsed, analysis: parsed.length >= 2 ? analyzeSet(parsed) : null };
  }, [key]);
  return { dice, leftOut: (deferred?.length ?? 0) - dice.length, analysis, isStale: deferred !== draft };
}
