import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { RollPad } from "@/features/class-runs/components/roll-pad";
import { registerPadServiceWorker } from "./register-service-worker";
import "./pad.css";

// The Roll pad's own page (pad.html): React, socket.io and the pad, nothing of the teachers' app.
createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <RollPad />
  </StrictMode>,
);
registerPadServiceWorker();
