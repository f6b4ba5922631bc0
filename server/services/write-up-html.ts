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
  allowedTags: ['p', 'h2', 'h3', 'h4', 'ul', 'ol', 'li', 'blockquote', 'pre', 'code', 'hr', 'br', 'strong', 'em', 's', 'u', 'a'],
  // ol start/type keep a list's numbering (the editor supports them); `transformTags` narrows them to plain values.
  allowedAttributes: { a: ['href', 'rel'], ol: ['start', 'type'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: {},
  allowedSchemesAppliedToAttributes: ['href'],
  allowProtocolRelative: false,
  allowedClasses: {},
  allowedStyles: {},
  disallowedTagsMode: 'discard',
  // Content of these is code or markup, never prose: drop it with the tag.
  nonTextTags: ['script', 'style', 'textarea', 'option', 'noscript', 'iframe', 'object', 'embed', 'template', 'xmp', 'noembed', 'noframes'],
  // Every link a creator writes is user content: it passes no rank and no window.opener.
  transformTags: {
    a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow' }),
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
  return sanitizeHtml(html, WRITE_UP_SANITIZE_OPTIONS);
}

/**
 * Renders a write-up to the sanitised HTML readers get. Validate with `writeUpDoc` first: the
 * output is always safe, but a document the schema refuses may throw (ProseMirror's RangeError).
 */
export function renderWriteUp(doc: WriteUpDoc): string {
  // ProseMirror's doc needs at least one block; an empty write-up is simply no HTML.
  if (!doc.content?.length) return '';
  return sanitizeWriteUpHtml(generateHTML(doc, extensions));
}
