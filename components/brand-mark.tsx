/** Epicycle's mark: a circle riding on a circle, drawn as hairlines. */
export function BrandMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <circle cx="16" cy="16" r="11" fill="none" stroke="currentColor" strokeWidth="1.2" />
      <circle cx="24.5" cy="9" r="4.5" fill="none" stroke="#0E5D63" strokeWidth="1.4" />
      <circle cx="27.2" cy="6.6" r="1.4" fill="#0E5D63" />
    </svg>
  );
}
