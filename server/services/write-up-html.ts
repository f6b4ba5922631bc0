import { generateHTML } from '@tiptap/html/server';
import sanitizeHtml from 'sanitize-html';
import type { WriteUpDoc } from '../../src/shared/write-up';
import { writeUpExtensionList } from '../../src/shared/write-up-extensions';

// Readers get only this HTML. Tiptap renders the (already validated) JSON with the editor's own
// configuration; sanitize-html then re-parses the result against an allow-list, so that a bug or
// a gap in the schema, in Tiptap or in a later extension still cannot put markup of our choosing
// in front of another reader.

const extensions = writeUpExtensionList();

/** The allow-list: the tags StarterKit + Link produce, with no styling, classes or handlers. */
export const WRITE_UP_SANITIZE_OPTIONS: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'h2', 'h3', 'h4', 'ul', 'ol', 'li', 'blockquote', 'pre', 'code', 'hr', 'br', 'strong', 'em', 's', 'u', 'a', 'img'],
  // ol start/type keep a list's numbering (the editor supports them); `transformTags` narrows them to plain values.
  allowedAttributes: {
    a: ['href', 'rel'],
    ol: ['start', 'type'],
    img: ['src', 'srcset', 'sizes', 'alt', 'width', 'height', 'loading', 'decoding', 'data-media-id'],
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: {},
  allowedSchemesAppliedToAttributes: ['href', 'src'],
  allowProtocolRelative: false,
  allowedClasses: {},
  allowedStyles: {},
  disallowedTagsMode: 'discard',
  // Content of these is code or markup, never prose: drop it with the tag.
  nonTextTags: ['script', 'style', 'textarea', 'option', 'noscript', 'iframe', 'object', 'embed', 'template', 'xmp', 'noembed', 'noframes'],
  // Every link a creator writes is user content: it passes no rank and no window.opener.
  transformTags: {
    a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow' }),
    // Pictures come only from this site's media store: anything else loses its source (and is dropped below).
    img: (tagName, attribs) => {
      const local = (u: string | undefined) => (u !== undefined && /^\/files\/\d+\/[0-9a-f]{64}\/[a-z0-9.]+$/.test(u) ? u : undefined);
      const srcset = (attribs.srcset ?? '')
        .split(',')
        .map((s) => s.trim().split(/\s+/))
        .filter(([u, w]) => local(u) && /^\d{1,5}w$/.test(w ?? ''))
        .map(([u, w]) => `${u} ${w}`)
        .join(', ');
      const num = (v: string | undefined) => (v !== undefined && /^\d{1,5}$/.test(v) ? v : undefined);
      const out: Record<string, string> = {};
      const src = local(attribs.src);
      if (src) out.src = src;
      if (srcset) out.srcset = srcset;
      for (const [k, v] of [
        ['width', num(attribs.width)],
        ['height', num(attribs.height)],
        ['data-media-id', num(attribs['data-media-id'])],
      ] as const)
        if (v) out[k] = v;
      out.alt = attribs.alt ?? '';
      out.sizes = '(min-width: 64rem) 68ch, 100vw';
      out.loading = 'lazy';
      out.decoding = 'async';
      return { tagName, attribs: out };
    },
    ol: (tagName, { start, type }) => ({
      tagName,
      attribs: {
        ...(start !== undefined && /^\d{1,7}$/.test(start) ? { start } : {}),
        ...(type !== undefined && ['1', 'a', 'A', 'i', 'I'].includes(type) ? { type } : {}),
      },
    }),
  },
};

/** Sanitises HTML against the write-up allow-list (the second line behind the schema). */
export function sanitizeWriteUpHtml(html: string): string {
  return sanitizeHtml(html, {
    ...WRITE_UP_SANITIZE_OPTIONS,
    // A picture without a source of ours is dropped entirely.
    exclusiveFilter: (frame) => frame.tag === 'img' && !frame.attribs.src,
  });
}

/** What the renderer needs to know of each stored photo a write-up shows. */
export type WriteUpImages = ReadonlyMap<number, { src: string; srcset: string; width: number; height: number }>;

/** Fills each picture node's source and sizes from the media table (unknown ids are rendered without, and dropped). */
function withImages(doc: WriteUpDoc, images: WriteUpImages): WriteUpDoc {
  const fill = (nodes: WriteUpDoc['content']): WriteUpDoc['content'] =>
    nodes?.map((n) => {
      if (n.type === 'mediaImage') {
        const img = images.get(n.attrs.mediaId);
        return {
          ...n,
          attrs: { ...n.attrs, src: img?.src ?? null, ...(img ? { srcset: img.srcset, width: img.width, height: img.height } : {}) },
        } as typeof n;
      }
      if ('content' in n && Array.isArray(n.content) && n.type !== 'paragraph' && n.type !== 'heading' && n.type !== 'codeBlock')
        return { ...n, content: fill(n.content as WriteUpDoc['content']) } as typeof n;
      return n;
    });
  return { ...doc, content: fill(doc.content) };
}

/**
 * Renders a write-up to the sanitised HTML readers get. Validate with `writeUpDoc` first: the
 * output is always safe, but a document the schema refuses may throw (ProseMirror's RangeError).
 */
export function renderWriteUp(doc: WriteUpDoc, images: WriteUpImages = new Map()): string {
  // ProseMirror's doc needs at least one block; an empty write-up is simply no HTML.
  if (!doc.content?.length) return '';
  return sanitizeWriteUpHtml(generateHTML(withImages(doc, images), extensions));
}
