import { useParams } from "react-router-dom";
import { RollPad } from "@/features/class-runs/components/roll-pad";

/** /pad and /pad/:code: the Roll pad on pupils' phones, with no account. */
export function RollPadRoute() {
  const { code } = useParams();
  return <RollPad key={code ?? "none"} code={code ?? null} />;
}
