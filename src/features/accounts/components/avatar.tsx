/** Up to two initials from a display name ("Ida Ironside" → "II"), for people without a picture. */
export function initials(name: string): string {
  const letters = name
    .trim()
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((word) => Array.from(word)[0] ?? '');
  return letters.join('').toUpperCase() || '?';
}

// Fixed sizes as classes: the CSP allows no inline style attributes.
const SIZES = {
  28: 'h-7 w-7 text-[11px]',
  36: 'h-9 w-9 text-sm',
  56: 'h-14 w-14 text-[22px]',
} as const;

interface AvatarProps {
  name: string;
  url: string | null;
  /** 28 px in the header, larger on account pages. */
  size?: keyof typeof SIZES;
  /** Empty when the name is printed beside the picture (it would be read twice). */
  alt?: string;
}

/** A person's picture in a round frame, or their initials on brass when they have none. */
export function Avatar({ name, url, size = 28, alt = '' }: AvatarProps) {
  const sized = SIZES[size];
  if (url) {
    return <img src={url} alt={alt} width={size} height={size} className={`${sized} shrink-0 rounded-[50%] bg-paper-2 object-cover`} />;
  }
  return (
    <span
      role={alt ? 'img' : undefined}
      aria-label={alt || undefined}
      aria-hidden={alt ? undefined : true}
      // Ink on brass clears 4.5:1; brass is the fill here, never the text.
      className={`${sized} inline-flex shrink-0 items-center justify-center rounded-[50%] bg-brass font-condensed leading-none font-semibold text-ink`}
    >
      {initials(name)}
    </span>
  );
}
