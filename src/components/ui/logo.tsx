export function Logo({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="var(--color-ink)" />
      <path
        d="M16 16c0-1.7 1.3-3 3-3s3 1.3 3 3-1.9 5-6 5-7-3.1-7-7 3.6-8 8.5-8 9.5 4 9.5 9.5"
        fill="none"
        stroke="var(--color-copper)"
        strokeWidth="2.4"
        strokeLinecap="round"
      />
    </svg>
  );
}
