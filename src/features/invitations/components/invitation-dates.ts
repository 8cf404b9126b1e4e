import { formatDateTime } from "@/lib/format";

/** An invitation's date and time as the screens show it, e.g. "10 Feb 2026, 14:05". */
export function invitationDate(iso: string) {
  return formatDateTime(iso);
}

/** "in 6 days", "in 5 hours" or "expired", for a pending invitation's expiry. */
export function timeLeft(iso: string, now = Date.now()) {
  const ms = new Date(iso).getTime() - now;
  if (ms <= 0) return "expired";
  const hours = Math.floor(ms / 3_600_000);
  if (hours >= 48) return `in ${Math.floor(hours / 24)} days`;
  if (hours >= 1) return `in ${hours} hour${hours === 1 ? "" : "s"}`;
  return "within the hour";
}
