import type { ClassRun } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { isLoopbackAddress, joinUrlOf, useQrCode } from "../hooks/use-join-url";

/** The join code spaced into two groups of three, easier to read from the back of a room. */
export function spacedCode(code: string): string {
  return `${code.slice(0, 3)} ${code.slice(3)}`;
}

/** How pupils join: the QR code (the join address), the join code and the address to type. */
export function JoinPanel({ run, size = "board" }: { run: ClassRun; size?: "board" | "wall" }) {
  const url = joinUrlOf(run);
  const qr = useQrCode(url, size === "wall" ? 720 : 360);
  const wall = size === "wall";
  return (
    <div className={`flex flex-col items-center gap-3 ${wall ? "text-white" : ""}`}>
      {qr ? (
        <img
          src={qr}
          data-testid="join-qr"
          alt={`QR code for the join address ${url}`}
          className={`rounded-xl bg-white ${wall ? "h-[min(46vh,30rem)] w-[min(46vh,30rem)] p-2" : "h-56 w-56 border-2 border-line"}`}
        />
      ) : (
        <div className={`grid place-items-center rounded-xl border-2 border-dashed ${wall ? "h-80 w-80" : "h-56 w-56"}`} role="status">
          Drawing the QR code…
        </div>
      )}
      <p className={wall ? "text-3xl" : "text-base"}>Join code</p>
      {/* A screen reader spells the code out character by character (aria-label is not read on a plain paragraph). */}
      <p className={`font-mono font-bold tracking-[0.15em] ${wall ? "text-[min(11vw,9rem)] leading-none" : "text-5xl"}`}>
        <span data-testid="join-code" aria-hidden="true">
          {spacedCode(run.joinCode)}
        </span>
        <span className="sr-only">Join code {run.joinCode.split("").join(" ")}</span>
      </p>
      <p className={`break-all text-center ${wall ? "text-3xl" : "text-base"}`}>
        or open <span className="font-bold">{url.replace(/^https?:\/\//, "")}</span>
      </p>
      {isLoopbackAddress(url) && !wall && (
        <Alert tone="caution" title="Phones cannot reach this address">
          This address names this computer only. Start Outroll with HOST=0.0.0.0 and APP_ORIGIN set to this computer’s address on the school
          network (docs/user-guide.md: What pupils’ phones need), then open the board at that address.
        </Alert>
      )}
    </div>
  );
}
