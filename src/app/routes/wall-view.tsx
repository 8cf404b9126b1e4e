import { useParams } from "react-router-dom";
import { WallViewPage } from "@/features/class-runs/components/wall-view-page";

/** /app/runs/:id/wall: the Wall view, full screen outside the app's frame. */
export function WallViewRoute() {
  const { id = "" } = useParams();
  return <WallViewPage key={id} runId={id} />;
}
