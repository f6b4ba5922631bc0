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

interface AvatarProps {
  name: string;
  url: string | null;
  /** 28 px in the header, larger on account pages. */
  size?: number;
  /** Empty when the name is printed beside the picture (it would be read twice). */
  alt?: string;
}

/** A person's picture in a round frame, or their initials on brass when they have none. */
export function Avatar({ name, url, size = 28, alt = '' }: AvatarProps) {
  const style = { width: size, height: size };
  if (url) {
    return <img src={url} alt={alt} width={size} height={size} style={style} className="shrink-0 rounded-[50%] bg-paper-2 object-cover" />;
  }
  return (
    <span
      role={alt ? 'img' : undefined}
      aria-label={alt || undefined}
      aria-hidden={alt ? undefined : true}
      style={{ ...style, fontSize: Math.round(size * 0.4) }}
      // Ink on brass clears 4.5:1; brass is the fill here, never the text.
      className="inline-flex shrink-0 items-center justify-center rounded-[50%] bg-brass font-condensed leading-none font-semibold text-ink"
    >
      {initials(name)}
    </span>
  );
}
