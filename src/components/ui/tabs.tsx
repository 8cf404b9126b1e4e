import { useId, useRef, type KeyboardEvent, type ReactNode } from "react";

export type TabItem = { id: string; label: string };

/** WAI-ARIA tabs: arrow keys, Home and End move between tabs; `children` is the chosen tab's panel (only it is rendered). */
export function Tabs({
  label,
  items,
  selected,
  onSelect,
  children,
}: {
  label: string;
  items: TabItem[];
  selected: string;
  onSelect: (id: string) => void;
  children: ReactNode;
}) {
  const baseId = useId();
  const refs = useRef<Record<string, HTMLButtonElement | null>>({});
  const index = Math.max(
    0,
    items.findIndex((item) => item.id === selected),
  );
  const current = items[index];

  const move = (event: KeyboardEvent) => {
    const last = items.length - 1;
    const next =
      event.key === "ArrowRight"
        ? index === last
          ? 0
          : index + 1
        : event.key === "ArrowLeft"
          ? index === 0
            ? last
            : index - 1
          : event.key === "Home"
            ? 0
            : event.key === "End"
              ? last
              : null;
    if (next === null) return;
    event.preventDefault();
    onSelect(items[next].id);
    refs.current[items[next].id]?.focus();
  };

  return (
    <div>
      <div role="tablist" aria-label={label} className="flex flex-wrap gap-1 border-b-2 border-line">
        {items.map((item) => {
          const active = item.id === current.id;
          return (
            <button
              key={item.id}
              ref={(element) => {
                refs.current[item.id] = element;
              }}
              type="button"
              role="tab"
              id={`${baseId}-tab-${item.id}`}
              aria-selected={active}
              aria-controls={`${baseId}-panel-${item.id}`}
              tabIndex={active ? 0 : -1}
              onClick={() => onSelect(item.id)}
              onKeyDown={move}
              className={`-mb-0.5 min-h-11 rounded-t-lg border-2 px-3 py-2 font-bold ${
                active ? "border-line border-b-shell bg-shell text-ink" : "border-transparent text-ink-soft hover:text-ink"
              }`}
            >
              {active && <span aria-hidden="true" className="mr-1 inline-block h-2 w-2 rounded-full bg-tide align-middle" />}
              {item.label}
            </button>
          );
        })}
      </div>
      <div
        role="tabpanel"
        id={`${baseId}-panel-${current.id}`}
        aria-labelledby={`${baseId}-tab-${current.id}`}
        tabIndex={0}
        className="pt-4 focus-visible:outline-offset-4"
      >
        {children}
      </div>
    </div>
  );
}
