import type { DepartmentRole } from "@shared/schemas/roles";

/** Harbourside Academy, our invented demo school (see ../shared/GLOSSARY.md). */
export const demoDepartment = { name: "Maths, Harbourside Academy", slug: "harbourside-maths" };

/** One password for every demo sign-in, so a newcomer can try each role. */
export const demoPassword = "harbour-tide-2026";

export const demoTeachers: { name: string; email: string; role: DepartmentRole }[] = [
  { name: "Priya Castellanos", email: "priya.castellanos@harbourside.test", role: "head" },
  { name: "Tomasz Reid", email: "tomasz.reid@harbourside.test", role: "teacher" },
  { name: "Ada Okafor", email: "ada.okafor@harbourside.test", role: "teacher" },
];

/** Names of the demo dice sets (sea birds, faces designed with our Set finder). */
export const demoDiceSetNames = {
  threeDice: "Kittiwake trio",
  reversing: "Shearwater swap",
  fiveDice: "Petrel five",
} as const;

/** The demo lesson whose closed class run fills the Run board for a new user (owned by Tomasz Reid, class 8K). */
export const demoRunLesson = { title: "No best die: the Kittiwake trio", classGroup: "8K", ownerEmail: "tomasz.reid@harbourside.test" };

export const demoClasses = ["8K", "9M"] as const;
