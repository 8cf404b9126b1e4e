import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./routes/app-layout";
import { AreaPreview } from "./routes/area-preview";
import { HomeRoute } from "./routes/home";
import { LandingRoute } from "./routes/landing";
import { NotFoundRoute } from "./routes/not-found";
import { SignInRoute } from "./routes/sign-in";
import { SignUpRoute } from "./routes/sign-up";
import { productArea } from "./product-areas";

export const router = createBrowserRouter([
  { path: "/", element: <LandingRoute /> },
  { path: "/sign-in", element: <SignInRoute /> },
  { path: "/sign-up", element: <SignUpRoute /> },
  {
    path: "/app",
    element: <AppLayout />,
    children: [
      { index: true, element: <HomeRoute /> },
      // Dice bench
      { path: "bench/*", element: <AreaPreview area={productArea("Dice bench")} /> },
      // Set finder
      { path: "finder/*", element: <AreaPreview area={productArea("Set finder")} /> },
      // Lessons
      { path: "lessons/*", element: <AreaPreview area={productArea("Lessons")} /> },
      // Department shelf
      { path: "shelf/*", element: <AreaPreview area={productArea("Department shelf")} /> },
      // Class runs
      { path: "runs/*", element: <AreaPreview area={productArea("Class runs")} /> },
      // Results
      { path: "results/*", element: <AreaPreview area={productArea("Results")} /> },
      { path: "*", element: <NotFoundRoute inShell /> },
    ],
  },
  { path: "*", element: <NotFoundRoute /> },
]);
