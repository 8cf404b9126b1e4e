const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });

/** A stored date as the shelf shows it, e.g. "3 Feb 2026". */
export function shelfDate(iso: string) {
  return dateFormat.format(new Date(iso));
}
