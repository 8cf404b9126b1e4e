import type { ReactNode } from "react";

const tones = {
  error: "border-alarm bg-alarm-light text-ink",
  caution: "border-beacon bg-beacon-light text-ink",
  info: "border-tide bg-tide-light text-ink",
} as const;

/** A boxed message; errors are announced to screen readers as they appear. */
export function Alert({ tone = "info", title, children }: { tone?: keyof typeof tones; title?: string; children: ReactNode }) {
  return (
    <div role={tone === "error" ? "alert" : "note"} className={`rounded-xl border-l-8 p-4 ${tones[tone]}`}>
      {title && <p className="font-bold">{title}</p>}
      <div className="text-base">{children}</div>
    </div>
  );
}
