interface LogoMarkProps {
  /** Edge length in CSS pixels. */
  size?: number;
  className?: string;
  /** Accessible name; leave empty when a visible wordmark stands beside it. */
  title?: string;
  /** 'light' on dark backgrounds: the plate turns a shade lighter so the mark keeps its edge. */
  tone?: 'dark' | 'light';
}

/**
 * The Kilowatch mark: a half dial with the needle in the efficient band, over three short bars for the sets on
 * the switchboard. Drawn for Kilowatch; see docs/decisions/001-visual-identity.md.
 */
export function LogoMark({ size = 32, className, title, tone = 'dark' }: LogoMarkProps) {
  return (
    <svg
      xmlns="http://www.w3.org/2000/svg"
      viewBox="0 0 32 32"
      width={size}
      height={size}
      className={className}
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
    >
      <rect width="32" height="32" rx="7" fill={tone === 'light' ? '#28444a' : '#142226'} />
      <path d="M7 20a9 9 0 0 1 18 0" fill="none" stroke="#9bb7bb" strokeWidth="2.4" strokeLinecap="round" />
      <path d="M16 20 21.5 12.5" stroke="#dc9c2c" strokeWidth="2.6" strokeLinecap="round" />
      <circle cx="16" cy="20" r="2.2" fill="#dc9c2c" />
      <path d="M9 25.5h3.5M14.25 25.5h3.5M19.5 25.5h3.5" stroke="#e2ebec" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

/** Mark plus the word "Kilowatch". */
export function Wordmark({ tone = 'dark' }: { tone?: 'dark' | 'light' }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark size={28} tone={tone} />
      <span className={`text-lead font-bold tracking-tight ${tone === 'light' ? 'text-hull-50' : 'text-hull-900'}`}>Kilowatch</span>
    </span>
  );
}
