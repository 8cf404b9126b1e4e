import { formatDate } from "@/lib/format";

/** A stored date as the shelf shows it, e.g. "3 Feb 2026". */
export function shelfDate(iso: string) {
  return formatDate(iso);
}
