import { useAbsoluteUrl } from '../../lib/site-context';

interface PageMetaProps {
  /** The page's own title; " — Rivet & Reel" is added. */
  title: string;
  description: string;
  /** The page's one address (path), for rel="canonical" and the share card. */
  canonicalPath: string;
  /** Unlisted builds and search results stay out of search engines. */
  noindex?: boolean;
  /** Open Graph type: "article" for episodes, "website" otherwise. */
  ogType?: 'article' | 'website';
  /** An absolute or site-relative image for the share card. */
  imagePath?: string | null;
  /** An Atom feed that follows this page. */
  feed?: { path: string; title: string } | null;
}

const DEFAULT_IMAGE = '/share-card.png';

/**
 * The head of every public page: title, description, canonical link, robots, Open Graph share card and
 * feed link. React 19 hoists these into <head>; the server moves them there in its HTML too.
 */
export function PageMeta({ title, description, canonicalPath, noindex, ogType = 'website', imagePath, feed }: PageMetaProps) {
  const abs = useAbsoluteUrl();
  const fullTitle = `${title} — Rivet & Reel`;
  const url = abs(canonicalPath);
  const image = /^https?:/.test(imagePath ?? '') ? imagePath! : abs(imagePath ?? DEFAULT_IMAGE);
  return (
    <>
      <title>{fullTitle}</title>
      <meta name="description" content={description} />
      <link rel="canonical" href={url} />
      {noindex ? <meta name="robots" content="noindex" /> : null}
      <meta property="og:site_name" content="Rivet & Reel" />
      <meta property="og:type" content={ogType} />
      <meta property="og:title" content={title} />
      <meta property="og:description" content={description} />
      <meta property="og:url" content={url} />
      <meta property="og:image" content={image} />
      <meta name="twitter:card" content="summary_large_image" />
      {feed ? <link rel="alternate" type="application/atom+xml" title={feed.title} href={abs(feed.path)} /> : null}
    </>
  );
}

/** A description of at most about 160 characters, cut at a word. */
export function clipDescription(text: string, max = 160): string {
  const clean = text.replace(/\s+/g, ' ').trim();
  if (clean.length <= max) return clean;
  const cut = clean.slice(0, max - 1);
  return `${cut.slice(0, Math.max(cut.lastIndexOf(' '), max / 2))}…`;
}
