import { cn } from '@/lib/utils';

export interface LogoProps {
  className?: string;
  /** Show the word "Brixhouse" beside the mark (default). Without it the mark is labelled for screen readers. */
  withWord?: boolean;
}

/** The Brixhouse mark: a sugarhouse roof with its steam cupola, sheltering a drop of sap. */
export function Logo({ className, withWord = true }: LogoProps) {
  return (
    <span className={cn('inline-flex items-center gap-2 text-slate', className)}>
      <svg
        viewBox="0 0 32 32"
        className="size-8 shrink-0"
        fill="none"
        {...(withWord ? { 'aria-hidden': true } : { role: 'img', 'aria-label': 'Brixhouse' })}
      >
        <path
          d="M3 15 12.5 7.7V4L16 1.6 19.5 4v3.7L29 15"
          className="stroke-current"
          strokeWidth="2.4"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
        <path
          d="M16 13.5c-.9 1.3-5.6 6.7-5.6 10.1a5.6 5.6 0 0 0 11.2 0c0-3.4-4.7-8.8-5.6-10.1Z"
          className="fill-spruce"
        />
        <path d="M13.6 24.2a2.5 2.5 0 0 0 2.1 2.3" className="stroke-birch-raised" strokeWidth="1.4" strokeLinecap="round" />
      </svg>
      {withWord ? <span className="text-xl font-bold tracking-tight">Brixhouse</span> : null}
    </span>
  );
}
