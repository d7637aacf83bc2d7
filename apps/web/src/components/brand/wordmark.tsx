/** The Lotwise mark: a conical flask drawn in the accent colour, with the name beside it. */
export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className ?? ''}`}>
      <svg viewBox="0 0 32 32" width="26" height="26" aria-hidden="true" focusable="false">
        <rect width="32" height="32" rx="7" fill="var(--color-accent-600, #9a4a1f)" />
        <path
          d="M11.5 7h9M13.5 7v7l-5 9a2 2 0 0 0 1.8 3h11.4a2 2 0 0 0 1.8-3l-5-9V7"
          fill="none"
          stroke="#fff"
          strokeWidth="2.2"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
        <path d="M11 20.5h10" stroke="#fff" strokeWidth="2.2" strokeLinecap="round" />
      </svg>
      <span className="text-[1.05rem] font-semibold tracking-tight text-ink-900">Lotwise</span>
    </span>
  );
}
