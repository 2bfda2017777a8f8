type ShadowloopMarkProps = {
  size?: number;
  title?: string;
};

/** A solid loop for the plant and a dashed offset loop, in the twin colour, for its shadow. */
export function ShadowloopMark({ size = 28, title }: ShadowloopMarkProps) {
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 32 32"
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
    >
      <circle cx="18.5" cy="18.5" r="9" fill="none" className="stroke-twin" strokeWidth="2" strokeDasharray="3.2 2.4" />
      <path d="M22 13.5A9 9 0 1 1 17.5 6" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      <path d="M15.2 2.6 19.6 6.1 15.4 9.6Z" fill="currentColor" />
    </svg>
  );
}
