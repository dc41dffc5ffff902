/** Crossfault's mark: two conductors that must never meet, with a break between them. */
export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={className}>
      <svg aria-hidden viewBox="0 0 28 28" className="mr-2 inline-block h-6 w-6 align-[-5px]">
        <rect
          x="1"
          y="1"
          width="26"
          height="26"
          rx="3"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
        />
        <path
          d="M6 22 12.5 15.5M15.5 12.5 22 6"
          stroke="var(--cf-accent)"
          strokeWidth="3"
          strokeLinecap="round"
        />
        <path d="M6 6 22 22" stroke="currentColor" strokeWidth="2" strokeDasharray="3 3" />
      </svg>
      <span className="font-semibold tracking-tight">Crossfault</span>
    </span>
  );
}
