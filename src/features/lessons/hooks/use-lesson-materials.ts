import { useDeferredValue, useMemo } from "react";
import { lessonMaterials, type LessonMaterialsResult, type MaterialsDie } from "@shared/lessons/lesson-materials";
import { lessonMaterialsFieldsSchema } from "@shared/schemas/lessons";

export type LessonMaterialsState =
  { ok: true; result: LessonMaterialsResult; isStale: boolean } | { ok: false; problems: string[]; isStale: boolean };

/**
 * The materials list and rolls verdict for the plan as typed so far, recomputed while the teacher edits.
 * Values are deferred so typing stays responsive; nothing is computed while a field it needs is invalid.
 */
export function useLessonMaterials(values: unknown, dice: MaterialsDie[] | null): LessonMaterialsState {
  const deferred = useDeferredValue(values);
  const key = useMemo(() => {
    const parsed = lessonMaterialsFieldsSchema.safeParse(deferred);
    return JSON.stringify(parsed.success ? { plan: parsed.data, dice } : { problems: parsed.error.issues.map((issue) => issue.message) });
  }, [deferred, dice]);
  const state = useMemo(() => {
    const parsed = JSON.parse(key) as { plan?: Parameters<typeof lessonMaterials>[0]; dice?: MaterialsDie[] | null; problems?: string[] };
    if (!parsed.plan) return { ok: false as const, problems: [...new Set(parsed.problems ?? [])] };
    return { ok: true as const, result: lessonMaterials(parsed.plan, parsed.dice ?? null) };
  }, [key]);
  return { ...state, isStale: deferred !== values };
}
