/** Our mark: a rising plume over a drop, drawn in the accent colour. */
export function PlumeMark({ className = 'h-6 w-6' }: { className?: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} aria-hidden="true">
      <path d="M12 21c-3 0-5-2-5-4.6 0-2.3 2.2-4.6 5-8 2.8 3.4 5 5.7 5 8C17 19 15 21 12 21z" fill="#137067" />
      <path d="M9 6.5c0-1.6 1.4-2 1.4-3.5M13.5 6c0-1.4 1.2-1.8 1.2-3" stroke="#1b8a80" strokeWidth="1.6" fill="none" strokeLinecap="round" />
    </svg>
  );
}
