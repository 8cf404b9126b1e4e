import { Route, Routes, useParams } from "react-router-dom";
import { ClassRunsPage } from "@/features/class-runs/components/class-runs-page";
import { RunBoardPage } from "@/features/class-runs/components/run-board-page";
import { NotFoundRoute } from "./not-found";

function RunBoardRoute() {
  const { id = "" } = useParams();
  return <RunBoardPage key={id} runId={id} />;
}

/** /app/runs: the Class runs list, and each run's Run board at /app/runs/:id. */
export function ClassRunsRoute() {
  return (
    <Routes>
      <Route index element={<ClassRunsPage />} />
      <Route path=":id" element={<RunBoardRoute />} />
      <Route path="*" element={<NotFoundRoute inShell />} />
    </Routes>
  );
}
