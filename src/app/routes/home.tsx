import { Link } from "react-router-dom";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { productAreas } from "../product-areas";

export function HomeRoute() {
  const { data } = useCurrentTeacher();
  const firstName = data?.user.name.split(" ")[0] ?? "";
  return (
    <>
      <PageHeader
        title={`Welcome, ${firstName}`}
        lead="Prepare a dice set, plan the lesson, then run it live with your class."
      />
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {productAreas.map((area) => (
          <li key={area.path}>
            <Link
              to={area.path}
              className="block h-full rounded-2xl border-2 border-line bg-shell p-5 hover:border-tide"
            >
              <h2 className="text-xl text-tide">{area.label}</h2>
              <p className="mt-1 text-ink-soft">{area.summary}</p>
            </Link>
          </li>
        ))}
      </ul>
      <div className="mt-8 max-w-3xl">
        <Alert tone="caution" title="Pupils are minors: keep their data out">
          Outroll never asks pupils for accounts, names or e-mail addresses. Groups choose a nickname when they join a class
          run; remind pupils not to use their real names, and do not type pupils&rsquo; names into lesson notes or uploads.
        </Alert>
      </div>
    </>
  );
}
