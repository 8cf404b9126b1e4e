import { Route, Routes, useParams, useSearchParams } from "react-router-dom";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { ClassReportPage } from "@/features/results/components/class-report-page";
import { NewPaperRunPage } from "@/features/results/components/new-paper-run-page";
import { PaperImportPage } from "@/features/results/components/paper-import-page";
import { TallyGridPage } from "@/features/results/components/tally-grid-page";
import { PoolingPage } from "@/features/results/components/pooling-page";
import { ResultsArchive } from "@/features/results/components/results-archive";
import { RunResultsPage } from "@/features/results/components/run-results-page";
import { NotFoundRoute } from "./not-found";

function RunResultsRoute() {
  const { runId = "" } = useParams();
  return <RunResultsPage key={runId} runId={runId} />;
}

function PaperImportRoute() {
  const { runId = "" } = useParams();
  return <PaperImportPage key={runId} runId={runId} />;
}

function TallyGridRoute() {
  const { runId = "" } = useParams();
  return <TallyGridPage key={runId} runId={runId} />;
}

function ClassReportRoute() {
  const { runId = "" } = useParams();
  const [params] = useSearchParams();
  return <ClassReportPage runId={runId} includeSimulated={params.get("includeSimulated") !== "false"} />;
}

/** The Results area: archive, a run's results, Paper import, the tally grid, the class report and pooling across classes. */
export function ResultsRoutes() {
  const teacher = useCurrentTeacher();
  const canSeeDepartment = teacher.data?.role === "head";
  return (
    <Routes>
      <Route index element={<ResultsArchive canSeeDepartment={canSeeDepartment} />} />
      <Route path="pooled" element={<PoolingPage canSeeDepartment={canSeeDepartment} />} />
      <Route path="paper-runs/new" element={<NewPaperRunPage />} />
      <Route path=":runId" element={<RunResultsRoute />} />
      <Route path=":runId/paper-import" element={<PaperImportRoute />} />
      <Route path=":runId/tally-grid" element={<TallyGridRoute />} />
      <Route path=":runId/report" element={<ClassReportRoute />} />
      <Route path="*" element={<NotFoundRoute inShell />} />
    </Routes>
  );
}
