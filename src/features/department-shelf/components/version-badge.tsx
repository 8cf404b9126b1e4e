/** A template's version as a labelled badge ("Version 2"), never told by colour alone. */
export function VersionBadge({ version, retired = false }: { version: number; retired?: boolean }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-1">
      <span className="inline-flex items-center rounded-full border-2 border-tide bg-tide-light px-2 py-0.5 text-sm font-bold text-ink">
        Version {version}
      </span>
      {retired && (
        <span className="rounded-full border-2 border-dashed border-ink-soft px-2 py-0.5 text-sm font-bold text-ink-soft">Retired</span>
      )}
    </span>
  );
}
