import { Link, Navigate, NavLink, Outlet, useLocation, useNavigate } from "react-router-dom";
import { departmentRoleLabels } from "@shared/schemas/roles";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useSignOut } from "@/features/account/api/sign-out";
import { useWaitingProposals } from "@/features/department-shelf/api/get-waiting-proposals";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Logo } from "@/components/ui/logo";
import { visibleProductAreas } from "../product-areas";

/** A count beside a navigation link; the words after the number are for screen readers. */
function CountBadge({ count, label }: { count: number; label: string }) {
  return (
    // relative: keeps the screen-reader words inside the scrolling navigation, so the page never scrolls sideways.
    <span className="relative ml-2 inline-flex min-w-6 items-center justify-center rounded-full bg-amber-400 px-1.5 text-sm font-bold text-ink">
      {count}
      <span className="sr-only">&nbsp;{label}</span>
    </span>
  );
}

/** Links every signed-in page carries at its foot. */
function AppFooter() {
  return (
    <footer className="no-print border-t-2 border-line">
      <div className="mx-auto flex max-w-7xl flex-wrap gap-x-6 gap-y-2 px-4 py-4 text-sm text-ink-soft sm:px-6">
        <Link to="/privacy" className="font-bold text-tide underline">
          Privacy notice
        </Link>
        <span>Pupils never have accounts: groups join with a nickname.</span>
      </div>
    </footer>
  );
}

/** The signed-in frame: who is signed in, the product areas, and the page. */
export function AppLayout() {
  const location = useLocation();
  const navigate = useNavigate();
  const teacher = useCurrentTeacher();
  const signOut = useSignOut();
  const isHead = teacher.data?.role === "head";
  // Only the head of department's queue is counted on the navigation; a teacher's own proposals show on the shelf.
  const waiting = useWaitingProposals(isHead);
  const waitingCount = isHead ? (waiting.data?.waiting ?? 0) : 0;

  if (teacher.isPending || (!teacher.data && teacher.isFetching)) {
    return (
      <p className="p-8 text-lg" role="status">
        Loading your department…
      </p>
    );
  }
  if (teacher.isError) {
    return (
      <div className="p-8">
        <Alert tone="error" title="Outroll could not load your account">
          {teacher.error.message}
        </Alert>
      </div>
    );
  }
  if (!teacher.data) {
    return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;
  }
  const { user, department, role } = teacher.data;

  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-10 focus:bg-shell focus:p-2">
        Skip to content
      </a>
      <header className="no-print bg-ink text-sand">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-3 sm:px-6">
          <NavLink to="/app" className="flex items-center gap-2 text-xl font-bold">
            <Logo className="h-8 w-8 text-tide" />
            Outroll
          </NavLink>
          <div className="flex items-center gap-3">
            <p className="text-right text-sm leading-tight">
              <span className="block font-bold">{user.name}</span>
              <span className="block text-sand/80">
                {role ? `${departmentRoleLabels[role]} · ${department?.name}` : "No department yet"}
              </span>
            </p>
            <Button
              variant="quiet"
              className="text-sand hover:bg-white/10"
              busy={signOut.isPending}
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate("/", { replace: true }) })}
            >
              Sign out
            </Button>
          </div>
        </div>
        <nav aria-label="Product areas" className="border-t border-white/10">
          <ul className="mx-auto flex max-w-7xl gap-1 overflow-x-auto px-2 sm:px-4">
            {visibleProductAreas(Boolean(role)).map((area) => (
              <li key={area.path} className="shrink-0">
                <NavLink
                  to={area.path}
                  className={({ isActive }) =>
                    `flex items-center border-b-4 px-3 py-3 font-bold ${isActive ? "border-amber-400 text-white" : "border-transparent text-sand/85 hover:text-white"}`
                  }
                >
                  {area.label}
                  {area.path === "/app/shelf" && waitingCount > 0 && (
                    <CountBadge count={waitingCount} label={waitingCount === 1 ? "proposal waiting" : "proposals waiting"} />
                  )}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:px-6 sm:py-8">
        <Outlet />
      </main>
      <AppFooter />
    </div>
  );
}
