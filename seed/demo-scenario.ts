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
