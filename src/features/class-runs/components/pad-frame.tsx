import type { ReactNode } from "react";
import { Logo } from "@/components/ui/logo";

/** The Roll pad's frame: big type, high contrast, one column that fits a 360 px phone. */
export function PadFrame({ children, status }: { children: ReactNode; status?: ReactNode }) {
  return (
    <div className="min-h-dvh bg-white text-ink">
      <header className="sticky top-0 z-10 flex items-center justify-between gap-2 bg-ink px-3 py-2 text-white">
        <span className="flex items-center gap-2 text-lg font-bold">
          <Logo className="h-7 w-7 text-tide-light" />
          Roll pad
        </span>
        {status}
      </header>
      <main className="mx-auto flex max-w-md flex-col gap-5 px-3 py-4 text-lg">{children}</main>
    </div>
  );
}
