/** Outroll's mark: two pips chasing each other round a circle, as the dice in a cycle do. */
export function Logo({ className = "h-9 w-9" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="3" y="3" width="26" height="26" rx="7" fill="currentColor" />
      <circle cx="11" cy="11" r="3" fill="#f6efe3" />
      <circle cx="21" cy="21" r="3" fill="#f59e0b" />
      <path d="M20 8a6 6 0 0 1 4 4" stroke="#5eead4" strokeWidth="2.5" fill="none" strokeLinecap="round" />
      <path d="M12 24a6 6 0 0 1-4-4" stroke="#5eead4" strokeWidth="2.5" fill="none" strokeLinecap="round" />
    </svg>
  );
}
