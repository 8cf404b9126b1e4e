/** The signed-in product areas, named as in the glossary, in the order a lesson is prepared and run. */
export const productAreas = [
  { path: "/app/bench", label: "Dice bench", summary: "Build a dice set and read its exact analysis." },
  { path: "/app/finder", label: "Set finder", summary: "Search for new dice sets with the properties you choose." },
  { path: "/app/lessons", label: "Lessons", summary: "Plan a lesson around a dice set, phase by phase." },
  { path: "/app/shelf", label: "Department shelf", summary: "Lesson templates shared by your head of department." },
  { path: "/app/runs", label: "Class runs", summary: "Run a lesson live: pupils record rolls on phones." },
  { path: "/app/results", label: "Results", summary: "Past class runs, exports, Paper import and reports." },
] as const;

export type ProductAreaLabel = (typeof productAreas)[number]["label"];

export function productArea(label: ProductAreaLabel) {
  return productAreas.find((area) => area.label === label)!;
}
