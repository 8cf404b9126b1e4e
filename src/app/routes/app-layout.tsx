import { Navigate, NavLink, Outlet, useLocation, useNavigate } from "react-router-dom";
import { departmentRoleLabels } from "@shared/schemas/roles";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useSignOut } from "@/features/account/api/sign-out";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Logo } from "@/components/ui/logo";
import { productAreas } from "../product-areas";

/** The signed-in frame: who is signed in, the product areas, and the page. */
export function AppLayout() {
  const location = useLocation();
  const navigate = useNavigate();
  const teacher = useCurrentTeacher();
  const signOut = useSignOut();

  if (teacher.isPending || (!teacher.data && teacher.isFetching)) {
    return <p className="p-8 text-lg" role="status">Loading your department…</p>;
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
    <div className="min-h-dvh">
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
            {productAreas.map((area) => (
              <li key={area.path} className="shrink-0">
                <NavLink
                  to={area.path}
                  className={({ isActive }) =>
                    `block border-b-4 px-3 py-3 font-bold ${isActive ? "border-amber-400 text-white" : "border-transparent text-sand/85 hover:text-white"}`
                  }
                >
                  {area.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto max-w-7xl px-4 py-6 sm:px-6 sm:py-8">
        <Outlet />
      </main>
    </div>
  );
}
