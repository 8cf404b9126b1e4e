import type { ComponentType } from "react";
import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./routes/app-layout";
import { LandingRoute } from "./routes/landing";
import { NotFoundRoute } from "./routes/not-found";

/**
 * A page loaded when first visited (its own chunk), so a teacher opening one area does not download the others' charts
 * and tables.
 */
function page<Module>(load: () => Promise<Module>, name: keyof Module) {
  return async () => ({ Component: (await load())[name] as ComponentType });
}

/** Shown while the first page's code loads. */
function PageLoading() {
  return (
    <p className="p-6 text-lg" role="status">
      Loading…
    </p>
  );
}

export const router = createBrowserRouter([
  {
    HydrateFallback: PageLoading,
    children: [
      { path: "/", element: <LandingRoute /> },
      { path: "/sign-in", lazy: page(() => import("./routes/sign-in"), "SignInRoute") },
      { path: "/sign-up", lazy: page(() => import("./routes/sign-up"), "SignUpRoute") },
      { path: "/join", lazy: page(() => import("./routes/join"), "JoinRoute") },
      // The Wall view (full screen, outside the app frame). The Roll pad is a page of its own (pad.html, src/pad/).
      { path: "/app/runs/:id/wall", lazy: page(() => import("./routes/wall-view"), "WallViewRoute") },
      { path: "/forgot-password", lazy: page(() => import("./routes/forgot-password"), "ForgotPasswordRoute") },
      { path: "/reset-password", lazy: page(() => import("./routes/reset-password"), "ResetPasswordRoute") },
      { path: "/dev/mail", lazy: page(() => import("./routes/dev-mail"), "DevMailRoute") },
      { path: "/privacy", lazy: page(() => import("./routes/privacy"), "PrivacyRoute") },
      {
        path: "/app",
        element: <AppLayout />,
        children: [
          { index: true, lazy: page(() => import("./routes/home"), "HomeRoute") },
          // Dice bench
          { path: "bench", lazy: page(() => import("./routes/dice-bench-list"), "DiceBenchListRoute") },
          { path: "bench/new", lazy: page(() => import("./routes/dice-bench-new"), "DiceBenchNewRoute") },
          { path: "bench/:id", lazy: page(() => import("./routes/dice-bench-set"), "DiceBenchSetRoute") },
          { path: "bench/:id/print", lazy: page(() => import("./routes/dice-bench-print"), "DiceBenchPrintRoute") },
          // Set finder
          { path: "finder", lazy: page(() => import("./routes/set-finder"), "SetFinderRoute") },
          // Lessons
          { path: "lessons", lazy: page(() => import("./routes/lessons-list"), "LessonsListRoute") },
          { path: "lessons/new", lazy: page(() => import("./routes/lesson-new"), "LessonNewRoute") },
          { path: "lessons/:id", lazy: page(() => import("./routes/lesson-edit"), "LessonEditRoute") },
          { path: "lessons/:id/print", lazy: page(() => import("./routes/lesson-print"), "LessonPrintRoute") },
          // Department shelf
          { path: "shelf/*", lazy: page(() => import("./routes/department-shelf"), "DepartmentShelfRoute") },
          // Department: colleagues and invitations
          { path: "department", lazy: page(() => import("./routes/department"), "DepartmentRoute") },
          // Class runs
          { path: "runs/*", lazy: page(() => import("./routes/class-runs"), "ClassRunsRoute") },
          // Results
          { path: "results/*", lazy: page(() => import("./routes/results"), "ResultsRoutes") },
          { path: "*", element: <NotFoundRoute inShell /> },
        ],
      },
      { path: "*", element: <NotFoundRoute /> },
    ],
  },
]);
