import { z } from 'zod';

// The episode write-up: Tiptap/ProseMirror JSON as the editor (StarterKit 3 + Link) produces it.
// The server validates every save against `writeUpDoc`, so only these node and mark types, in the
// places ProseMirror's schema allows them, are ever stored. Unknown node or mark types are
// rejected; unknown keys and attrs are stripped (ProseMirror ignores undeclared attrs too, so
// stripping loses nothing the renderer would use and lets a newer editor still save).

/** Limits on one write-up; checked before the structure so a hostile document costs little. */
export const WRITE_UP_LIMITS = { maxTextChars: 100_000, maxNodes: 5_000, maxDepth: 30 } as const;

export const WRITE_UP_HREF_SCHEMES = ['http:', 'https:', 'mailto:'] as const;

export type WriteUpLinkAttrs = { href: string; target?: string | null; rel?: string | null; class?: string | null; title?: string | null };
export type WriteUpMark = { type: 'bold' | 'italic' | 'strike' | 'code' | 'underline' } | { type: 'link'; attrs: WriteUpLinkAttrs };
export type WriteUpText = { type: 'text'; text: string; marks?: WriteUpMark[] };
export type WriteUpInline = WriteUpText | { type: 'hardBreak' };
export type WriteUpParagraph = { type: 'paragraph'; content?: WriteUpInline[] };
export type WriteUpHeading = { type: 'heading'; attrs: { level: 2 | 3 | 4 }; content?: WriteUpInline[] };
export type WriteUpCodeBlock = { type: 'codeBlock'; attrs?: { language?: string | null }; content?: Array<{ type: 'text'; text: string }> };
export type WriteUpListItem = { type: 'listItem'; content: WriteUpBlock[] };
export type WriteUpOrderedListAttrs = { start?: number; type?: '1' | 'a' | 'A' | 'i' | 'I' | null };
export type WriteUpBlock =
  | WriteUpParagraph
  | WriteUpHeading
  | WriteUpCodeBlock
  | { type: 'blockquote'; content: WriteUpBlock[] }
  | { type: 'bulletList'; content: WriteUpListItem[] }
  | { type: 'orderedList'; attrs?: WriteUpOrderedListAttrs; content: WriteUpListItem[] }
  | { type: 'horizontalRule' }
  | WriteUpImage;
/** A photo stored with the build's media (by id, never a data or foreign URL); `src` is for the editor's preview only. */
export type WriteUpImage = { type: 'mediaImage'; attrs: { mediaId: number; alt: string; src?: string | null } };
export type WriteUpNode = WriteUpBlock | WriteUpListItem | WriteUpInline;
export type WriteUpDoc = { type: 'doc'; content?: WriteUpBlock[] };

/**
 * Whether a link target is allowed: an absolute http, https or mailto URL. Whitespace and control
 * characters are refused outright because browsers drop them inside schemes (`jav\tascript:`).
 */
export function isAllowedWriteUpHref(href: string): boolean {
  // eslint-disable-next-line no-control-regex -- control characters are exactly what we refuse
  if (/[\u0000-\u0020\u007f-\u00a0\u1680\u2000-\u200f\u2028-\u202f\u205f\u3000\ufeff]/.test(href)) return false;
  let url: URL;
  try {
    url = new URL(href);
  } catch {
    return false;
  }
  if (!(WRITE_UP_HREF_SCHEMES as readonly string[]).includes(url.protocol)) return false;
  return url.protocol === 'mailto:' || url.hostname !== '';
}

const notAllowed = (what: string) => (iss: { input?: unknown }) => {
  const type = typeof iss.input === 'object' && iss.input !== null ? (iss.input as { type?: unknown }).type : undefined;
  return typeof type === 'string' ? `${what} “${type.slice(0, 40)}” is not allowed here` : `${what} needs a type`;
};

const optionalText = z.string().max(200).nullable().optional();
const linkMark = z.object({
  type: z.literal('link'),
  attrs: z.object({
    href: z.string().max(2048).refine(isAllowedWriteUpHref, 'Links must be full http, https or mailto addresses'),
    target: optionalText,
    rel: optionalText,
    class: optionalText,
    title: optionalText,
  }),
});
const simpleMark = (type: 'bold' | 'italic' | 'strike' | 'code' | 'underline') => z.object({ type: z.literal(type) });
const mark = z.discriminatedUnion(
  'type',
  [simpleMark('bold'), simpleMark('italic'), simpleMark('strike'), simpleMark('code'), simpleMark('underline'), linkMark],
  { error: notAllowed('The formatting') },
);

const text = z.object({
  type: z.literal('text'),
  // ProseMirror refuses empty text nodes, so they would break rendering later.
  text: z.string().min(1, 'Empty text'),
  marks: z
    .array(mark)
    .max(6)
    .refine((m) => new Set(m.map((x) => x.type)).size === m.length, 'The same formatting is applied twice')
    .optional(),
});
const inline: z.ZodType<WriteUpInline> = z.discriminatedUnion('type', [text, z.object({ type: z.literal('hardBreak') })], {
  error: notAllowed('Inside a paragraph, a'),
});
const inlineContent = z.array(inline).optional();

const paragraph = z.object({ type: z.literal('paragraph'), content: inlineContent });
const heading = z.object({
  type: z.literal('heading'),
  attrs: z.object({ level: z.literal([2, 3, 4], { error: 'Headings go from level 2 to 4 (the episode title is level 1)' }) }),
  content: inlineContent,
});
const codeBlock = z.object({
  type: z.literal('codeBlock'),
  attrs: z
    .object({
      language: z
        .string()
        .max(40)
        .regex(/^[A-Za-z0-9+#._-]*$/, 'A language name such as js or c++')
        .nullable()
        .optional(),
    })
    .optional(),
  // Code blocks hold plain text only (ProseMirror's `marks: ""`); stray marks are stripped.
  content: z
    .array(z.object({ type: z.literal('text', { error: 'A code block holds only text' }), text: z.string().min(1, 'Empty text') }))
    .optional(),
});

const listItem: z.ZodType<WriteUpListItem> = z.object({
  type: z.literal('listItem', { error: 'A list holds only list items' }),
  get content() {
    // StarterKit's list item is "paragraph block*".
    return z
      .array(block)
      .min(1, 'An empty list item')
      .refine((c) => c[0]?.type === 'paragraph', 'A list item starts with a paragraph');
  },
});
const listItems = z.array(listItem).min(1, 'An empty list');

const block: z.ZodType<WriteUpBlock> = z.discriminatedUnion(
  'type',
  [
    paragraph,
    heading,
    codeBlock,
    z.object({
      type: z.literal('blockquote'),
      get content() {
        return z.array(block).min(1, 'An empty quote');
      },
    }),
    z.object({ type: z.literal('bulletList'), content: listItems }),
    z.object({
      type: z.literal('orderedList'),
      attrs: z
        .object({ start: z.number().int().min(0).max(1_000_000).optional(), type: z.enum(['1', 'a', 'A', 'i', 'I']).nullable().optional() })
        .optional(),
      content: listItems,
    }),
    z.object({ type: z.literal('horizontalRule') }),
    z.object({
      type: z.literal('mediaImage'),
      attrs: z.object({
        mediaId: z.number().int().positive(),
        alt: z.string().trim().max(300),
        src: z
          .string()
          .max(300)
          .regex(/^\/files\/\d+\/[0-9a-f]{64}\/[a-z0-9.]+$/, 'A picture stored with this build')
          .nullable()
          .optional(),
      }),
    }),
  ],
  { error: notAllowed('A') },
);

const docShape = z.object({ type: z.literal('doc', { error: 'A write-up is a “doc”' }), content: z.array(block).optional() });

/** A Tiptap JSON write-up: size limits first, then the structure (see the note at the top). */
export const writeUpDoc: z.ZodType<WriteUpDoc> = z.unknown().superRefine(checkLimits).pipe(docShape);

export const EMPTY_WRITE_UP: WriteUpDoc = { type: 'doc', content: [{ type: 'paragraph' }] };

/** The stored photos a write-up shows, by media id, in order. */
export function writeUpImageIds(doc: WriteUpDoc): number[] {
  const ids: number[] = [];
  const walk = (nodes: ReadonlyArray<{ type: string; attrs?: unknown; content?: unknown }> | undefined) => {
    for (const n of nodes ?? []) {
      if (n.type === 'mediaImage') ids.push((n.attrs as { mediaId: number }).mediaId);
      if (Array.isArray(n.content)) walk(n.content as Array<{ type: string }>);
    }
  };
  walk(doc.content);
  return ids;
}

/** Plain text of a write-up (for summaries and search): one line per block, hard breaks kept. */
export function writeUpText(doc: WriteUpDoc): string {
  return textOf(doc).trim();
}

function textOf(node: { type: string; text?: string; content?: ReadonlyArray<WriteUpNode> }): string {
  if (node.type === 'text') return node.text ?? '';
  if (node.type === 'hardBreak') return '\n';
  const children = node.content ?? [];
  if (node.type === 'paragraph' || node.type === 'heading' || node.type === 'codeBlock') return children.map(textOf).join('');
  return children
    .map(textOf)
    .filter((t) => t !== '')
    .join('\n');
}

const count = (n: number) => n.toLocaleString('en-GB');

/** Walks the raw input without recursion so that deep or huge documents cannot exhaust the stack. */
function checkLimits(input: unknown, ctx: z.RefinementCtx): void {
  const { maxTextChars, maxNodes, maxDepth } = WRITE_UP_LIMITS;
  const stack: Array<{ node: unknown; depth: number }> = [{ node: input, depth: 1 }];
  let nodes = 0;
  let chars = 0;
  for (let item = stack.pop(); item; item = stack.pop()) {
    const { node, depth } = item;
    if (typeof node !== 'object' || node === null) continue;
    nodes += 1;
    if (nodes > maxNodes) {
      ctx.addIssue({
        code: 'custom',
        message: `The write-up has too many parts: at most ${count(maxNodes)} paragraphs, list items and pieces of text`,
      });
      return;
    }
    if (depth > maxDepth) {
      ctx.addIssue({
        code: 'custom',
        message: `The write-up is nested too deeply: at most ${maxDepth} levels of lists and quotes inside each other`,
      });
      return;
    }
    const { text, content } = node as { text?: unknown; content?: unknown };
    if (typeof text === 'string') chars += text.length;
    if (Array.isArray(content)) for (const child of content as unknown[]) stack.push({ node: child, depth: depth + 1 });
  }
  if (chars > maxTextChars) {
    ctx.addIssue({
      code: 'custom',
      message: `The write-up is too long: at most ${count(maxTextChars)} characters of text (this one has ${count(chars)})`,
    });
  }
}
