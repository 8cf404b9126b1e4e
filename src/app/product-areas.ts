/**
 * The signed-in product areas, named as in the glossary, in the order a lesson is prepared and run; the Department
 * page is listed only for members of a department.
 */
export const productAreas = [
  { path: "/app/bench", label: "Dice bench", summary: "Build a dice set and read its exact analysis.", needsDepartment: false },
  { path: "/app/finder", label: "Set finder", summary: "Search for new dice sets with the properties you choose.", needsDepartment: false },
  { path: "/app/lessons", label: "Lessons", summary: "Plan a lesson around a dice set, phase by phase.", needsDepartment: false },
  { path: "/app/shelf", label: "Department shelf", summary: "Lesson templates shared by your head of department.", needsDepartment: false },
  { path: "/app/runs", label: "Class runs", summary: "Run a lesson live: pupils record rolls on phones.", needsDepartment: false },
  { path: "/app/results", label: "Results", summary: "Past class runs, exports, Paper import and reports.", needsDepartment: false },
  {
    path: "/app/department",
    label: "Department",
    summary: "Your colleagues, and for the head of department, invitations.",
    needsDepartment: true,
  },
] as const;

/** The areas a teacher sees: the Department page only once they belong to a department. */
export function visibleProductAreas(inDepartment: boolean) {
  return productAreas.filter((area) => inDepartment || !area.needsDepartment);
}

export type ProductAreaLabel = (typeof productAreas)[number]["label"];

export function productArea(label: ProductAreaLabel) {
  return productAreas.find((area) => area.label === label)!;
}
