/**
 * The Meniscus mark: a tube with the curved surface of a liquid, read at eye level along the line.
 */
export function LogoMark({ size = 32, className }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" className={className} focusable="false">
      <rect x="2" y="2" width="28" height="28" rx="7" fill="var(--brand)" />
      <path d="M11 6v16a5 5 0 0 0 10 0V6" fill="none" stroke="var(--on-brand)" strokeWidth="2.2" strokeLinecap="round" />
      <path d="M12.1 15.5q3.9 3.4 7.8 0V22a3.9 3.9 0 0 1-7.8 0z" fill="var(--on-brand)" opacity="0.55" />
      <path d="M7 17.6h18" stroke="var(--accent-soft)" strokeWidth="1.6" strokeLinecap="round" strokeDasharray="2 2.2" />
    </svg>
  );
}

export function Logo({ className }: { className?: string }) {
  return (
    <span className={className ? `inline-flex items-center gap-2 ${className}` : "inline-flex items-center gap-2"}>
      <LogoMark />
      <span className="text-xl font-bold tracking-tight">Meniscus</span>
    </span>
  );
}
