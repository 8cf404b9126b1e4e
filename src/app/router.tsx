import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./routes/app-layout";
import { ClassRunsRoute } from "./routes/class-runs";
import { RollPadRoute } from "./routes/roll-pad";
import { WallViewRoute } from "./routes/wall-view";
import { DepartmentShelfRoute } from "./routes/department-shelf";
import { DevMailRoute } from "./routes/dev-mail";
import { ForgotPasswordRoute } from "./routes/forgot-password";
import { JoinRoute } from "./routes/join";
import { ResetPasswordRoute } from "./routes/reset-password";
import { DiceBenchListRoute } from "./routes/dice-bench-list";
import { DiceBenchNewRoute } from "./routes/dice-bench-new";
import { DiceBenchPrintRoute } from "./routes/dice-bench-print";
import { DiceBenchSetRoute } from "./routes/dice-bench-set";
import { HomeRoute } from "./routes/home";
import { LandingRoute } from "./routes/landing";
import { LessonEditRoute } from "./routes/lesson-edit";
import { LessonNewRoute } from "./routes/lesson-new";
import { LessonPrintRoute } from "./routes/lesson-print";
import { LessonsListRoute } from "./routes/lessons-list";
import { NotFoundRoute } from "./routes/not-found";
import { SignInRoute } from "./routes/sign-in";
import { SetFinderRoute } from "./routes/set-finder";
import { SignUpRoute } from "./routes/sign-up";
import { ResultsRoutes } from "./routes/results";

export const router = createBrowserRouter([
  { path: "/", element: <LandingRoute /> },
  { path: "/sign-in", element: <SignInRoute /> },
  { path: "/sign-up", element: <SignUpRoute /> },
  { path: "/join", element: <JoinRoute /> },
  // Roll pad (pupils' phones, no account) and the Wall view (full screen, outside the app frame)
  { path: "/pad", element: <RollPadRoute /> },
  { path: "/pad/:code", element: <RollPadRoute /> },
  { path: "/app/runs/:id/wall", element: <WallViewRoute /> },
  { path: "/forgot-password", element: <ForgotPasswordRoute /> },
  { path: "/reset-password", element: <ResetPasswordRoute /> },
  { path: "/dev/mail", element: <DevMailRoute /> },
  {
    path: "/app",
    element: <AppLayout />,
    children: [
      { index: true, element: <HomeRoute /> },
      // Dice bench
      { path: "bench", element: <DiceBenchListRoute /> },
      { path: "bench/new", element: <DiceBenchNewRoute /> },
      { path: "bench/:id", element: <DiceBenchSetRoute /> },
      { path: "bench/:id/print", element: <DiceBenchPrintRoute /> },
      // Set finder
      { path: "finder", element: <SetFinderRoute /> },
      // Lessons
      { path: "lessons", element: <LessonsListRoute /> },
      { path: "lessons/new", element: <LessonNewRoute /> },
      { path: "lessons/:id", element: <LessonEditRoute /> },
      { path: "lessons/:id/print", element: <LessonPrintRoute /> },
      // Department shelf
      { path: "shelf/*", element: <DepartmentShelfRoute /> },
      // Class runs
      { path: "runs/*", element: <ClassRunsRoute /> },
      // Results
      { path: "results/*", element: <ResultsRoutes /> },
      { path: "*", element: <NotFoundRoute inShell /> },
    ],
  },
  { path: "*", element: <NotFoundRoute /> },
]);
