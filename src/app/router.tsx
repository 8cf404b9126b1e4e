import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./routes/app-layout";
import { AreaPreview } from "./routes/area-preview";
import { HomeRoute } from "./routes/home";
import { LandingRoute } from "./routes/landing";
import { NotFoundRoute } from "./routes/not-found";
import { SignInRoute } from "./routes/sign-in";
import { SignUpRoute } from "./routes/sign-up";
import { productAreas } from "./product-areas";

export const router = createBrowserRouter([
  { path: "/", element: <LandingRoute /> },
  { path: "/sign-in", element: <SignInRoute /> },
  { path: "/sign-up", element: <SignUpRoute /> },
  {
    path: "/app",
    element: <AppLayout />,
    children: [
      { index: true, element: <HomeRoute /> },
      ...productAreas.map((area) => ({ path: area.path, element: <AreaPreview area={area} /> })),
      { path: "*", element: <NotFoundRoute inShell /> },
    ],
  },
  { path: "*", element: <NotFoundRoute /> },
]);
