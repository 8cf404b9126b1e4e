import { SetFinderScreen } from "@/features/set-finder/components/set-finder-screen";

export function SetFinderRoute() {
  return <SetFinderScreen />;
}
