/** Ohmstead's mark: four probe contacts on a bar with the current path drawn as a copper meander. */
export function OhmsteadMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="7" fill="#1e293b" />
      <path d="M5 16h4l2-5 3 10 3-10 3 10 2-5h5" fill="none" stroke="#cf7c45" strokeWidth="2.4" strokeLinejoin="round" strokeLinecap="round" />
      <circle cx="5" cy="16" r="1.8" fill="#f5e3d3" />
      <circle cx="27" cy="16" r="1.8" fill="#f5e3d3" />
    </svg>
  );
}
