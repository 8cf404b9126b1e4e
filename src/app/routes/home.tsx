import { Link } from "react-router-dom";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useWaitingProposals } from "@/features/department-shelf/api/get-waiting-proposals";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/link-button";
import { PageHeader } from "@/components/ui/page-header";
import { visibleProductAreas } from "../product-areas";

/** The head of department's queue on the home page: how many proposals wait, and the way to them. */
function WaitingProposalsPanel() {
  const waiting = useWaitingProposals(true);
  if (!waiting.data) return null;
  const count = waiting.data.waiting;
  return (
    <section
      aria-labelledby="waiting-proposals-heading"
      className={`mb-6 flex max-w-3xl flex-wrap items-center justify-between gap-3 rounded-2xl border-2 p-5 ${
        count > 0 ? "border-beacon bg-beacon-light" : "border-line bg-shell"
      }`}
    >
      <div>
        <h2 id="waiting-proposals-heading" className="text-xl">
          {count === 0
            ? "No proposals waiting"
            : count === 1
              ? "1 proposal waits for your decision"
              : `${count} proposals wait for your decision`}
        </h2>
        <p className="mt-1 text-ink-soft">
          {count === 0
            ? "When a teacher proposes a lesson for the Department shelf, it is counted here and on the navigation."
            : "Teachers in your department proposed lessons for the Department shelf. Read each one, then approve or decline it."}
        </p>
      </div>
      {count > 0 && (
        <LinkButton to="/app/shelf/proposals" variant="primary">
          Decide on the proposals
        </LinkButton>
      )}
    </section>
  );
}

export function HomeRoute() {
  const { data } = useCurrentTeacher();
  const firstName = data?.user.name.split(" ")[0] ?? "";
  return (
    <>
      <PageHeader title={`Welcome, ${firstName}`} lead="Prepare a dice set, plan the lesson, then run it live with your class." />
      {data?.role === "head" && <WaitingProposalsPanel />}
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {visibleProductAreas(Boolean(data?.role)).map((area) => (
          <li key={area.path}>
            <Link to={area.path} className="block h-full rounded-2xl border-2 border-line bg-shell p-5 hover:border-tide">
              <h2 className="text-xl text-tide">{area.label}</h2>
              <p className="mt-1 text-ink-soft">{area.summary}</p>
            </Link>
          </li>
        ))}
      </ul>
      <div className="mt-8 max-w-3xl">
        <Alert tone="caution" title="Pupils are minors: keep their data out">
          Outroll never asks pupils for accounts, names or e-mail addresses. Groups choose a nickname when they join a class run; remind
          pupils not to use their real names, and do not type pupils&rsquo; names into lesson notes or uploads.{" "}
          <Link to="/privacy" className="font-bold underline">
            Read the privacy notice
          </Link>
          .
        </Alert>
      </div>
    </>
  );
}
