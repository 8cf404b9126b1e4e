import { LessonsTable } from "@/features/lessons/components/lessons-table";

export function LessonsListRoute() {
  return <LessonsTable />;
}
