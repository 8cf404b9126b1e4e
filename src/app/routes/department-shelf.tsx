import { Link, Navigate, Route, Routes, useLocation, useParams, useSearchParams } from "react-router-dom";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useWaitingProposals } from "@/features/department-shelf/api/get-waiting-proposals";
import { ProposalsPanel } from "@/features/department-shelf/components/proposals-panel";
import { ShelfTemplatesPanel } from "@/features/department-shelf/components/shelf-templates-panel";
import { TemplateDetailPanel } from "@/features/department-shelf/components/template-detail-panel";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { NotFoundRoute } from "./not-found";

const sections = [
  { to: "/app/shelf", label: "Templates", matches: (path: string) => path === "/app/shelf" || path.startsWith("/app/shelf/templates") },
  { to: "/app/shelf/proposals", label: "Proposals", matches: (path: string) => path.startsWith("/app/shelf/proposals") },
];

function TemplateRoute({ isHead }: { isHead: boolean }) {
  const { id = "" } = useParams();
  const [params] = useSearchParams();
  const version = Number(params.get("version"));
  return (
    <TemplateDetailPanel key={id} templateId={id} version={Number.isInteger(version) && version > 0 ? version : null} isHead={isHead} />
  );
}

/** The Department shelf: templates and proposals (colleagues and invitations are on the Department page). */
export function DepartmentShelfRoute() {
  const teacher = useCurrentTeacher();
  const location = useLocation();
  const role = teacher.data?.role ?? null;
  const isHead = role === "head";
  const waiting = useWaitingProposals(isHead);
  const waitingCount = isHead ? (waiting.data?.waiting ?? 0) : 0;
  if (!role) {
    return (
      <>
        <PageHeader title="Department shelf" />
        <Alert tone="info" title="Join a department first">
          The shelf holds the lesson templates your head of department shares. Ask them for an invitation.
        </Alert>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="Department shelf"
        lead={
          isHead
            ? "Publish lessons as templates for your department, update them with new versions, and decide on teachers' proposals."
            : "Templates your head of department shares. Copy one into your own lessons, or propose one of yours."
        }
      />
      <nav aria-label="Department shelf" className="mb-6 border-b-2 border-line">
        <ul className="flex flex-wrap gap-1">
          {sections.map((section) => {
            const active = section.matches(location.pathname.replace(/\/$/, ""));
            return (
              <li key={section.to}>
                <Link
                  to={section.to}
                  aria-current={active ? "page" : undefined}
                  className={`-mb-0.5 inline-flex min-h-11 items-center rounded-t-lg border-2 px-3 py-2 font-bold ${
                    active ? "border-line border-b-sand bg-sand text-ink" : "border-transparent text-ink-soft hover:text-ink"
                  }`}
                >
                  {active && <span aria-hidden="true" className="mr-1 inline-block h-2 w-2 rounded-full bg-tide" />}
                  {section.label}
                  {section.label === "Proposals" && waitingCount > 0 && (
                    <span className="relative ml-2 inline-flex min-w-6 items-center justify-center rounded-full bg-amber-400 px-1.5 text-sm text-ink">
                      {waitingCount}
                      <span className="sr-only">&nbsp;waiting</span>
                    </span>
                  )}
                </Link>
              </li>
            );
          })}
        </ul>
      </nav>
      <Routes>
        <Route index element={<ShelfTemplatesPanel isHead={isHead} />} />
        <Route path="templates/:id" element={<TemplateRoute isHead={isHead} />} />
        <Route path="proposals" element={<ProposalsPanel isHead={isHead} />} />
        {/* Colleagues moved to their own page; old links and bookmarks land there. */}
        <Route path="colleagues" element={<Navigate to="/app/department" replace />} />
        <Route path="*" element={<NotFoundRoute inShell />} />
      </Routes>
    </>
  );
}
