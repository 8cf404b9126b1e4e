import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { joinCodeSchema } from "@shared/schemas/joining";
import { lookUpPadRun } from "@/features/class-runs/api/get-pad-run";
import { codeFromPath, RollPad } from "@/features/class-runs/components/roll-pad";
import { storedPadSession } from "@/features/class-runs/delivery/pad-connection";
import { registerPadServiceWorker } from "./register-service-worker";
import "./pad.css";

// A phone opening /pad/CODE asks for the run while React starts, rather than after its first render.
const code = joinCodeSchema.safeParse(codeFromPath(window.location.pathname));
if (code.success && storedPadSession()?.code !== code.data) void lookUpPadRun(code.data).catch(() => undefined);

// The Roll pad's own page (pad.html): React, socket.io and the pad, nothing of the teachers' app.
createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <RollPad />
  </StrictMode>,
);
registerPadServiceWorker();
