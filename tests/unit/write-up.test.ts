import { Window } from 'happy-dom';
import { afterAll, describe, expect, it } from 'vitest';
import { renderWriteUp, sanitizeWriteUpHtml } from '../../server/services/write-up-html';
import { WRITE_UP_LIMITS, writeUpDoc, writeUpText, type WriteUpBlock, type WriteUpDoc } from '../../src/shared/write-up';

// Sources of the check values:
// - EDITOR_OUTPUT: captured from Tiptap 3.35 `generateJSON` with `writeUpExtensionList()` — the
//   same ProseMirror `doc.toJSON()` the editor's `getJSON()` returns;
// - expected HTML: Tiptap StarterKit's renderHTML for each node (element names of the HTML Living
//   Standard), after our allow-list;
// - PAYLOADS: OWASP XSS Filter Evasion Cheat Sheet (vectors and their case, whitespace and entity
//   encodings), plus the mXSS namespace-confusion vector named in the brief;
// - limits: our own WRITE_UP_LIMITS (100,000 characters, 5,000 nodes, depth 30).

const EDITOR_OUTPUT: WriteUpDoc = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Brakes' }] },
    {
      type: 'paragraph',
      content: [
        { type: 'text', text: 'Some ' },
        { type: 'text', marks: [{ type: 'bold' }], text: 'bold' },
        { type: 'text', text: ' and ' },
        {
          type: 'text',
          marks: [
            {
              type: 'link',
              attrs: { href: 'https://example.com/x', target: null, rel: 'noopener noreferrer nofollow', class: null, title: null },
            },
          ],
          text: 'link',
        },
        { type: 'hardBreak' },
        { type: 'text', text: 'next' },
      ],
    },
    { type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'one' }] }] }] },
    {
      type: 'orderedList',
      attrs: { start: 3, type: null },
      content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'three' }] }] }],
    },
    { type: 'codeBlock', attrs: { language: 'js' }, content: [{ type: 'text', text: 'x = 1' }] },
    { type: 'blockquote', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'q' }] }] },
    { type: 'horizontalRule' },
    {
      type: 'paragraph',
      content: [
        { type: 'text', marks: [{ type: 'underline' }], text: 'u' },
        { type: 'text', marks: [{ type: 'strike' }], text: 's' },
        { type: 'text', marks: [{ type: 'italic' }], text: 'e' },
        { type: 'text', marks: [{ type: 'code' }], text: 'c' },
      ],
    },
  ],
};

const para = (text: string): WriteUpBlock => ({ type: 'paragraph', content: [{ type: 'text', text }] });
const doc = (...content: WriteUpBlock[]): WriteUpDoc => ({ type: 'doc', content });
const linkDoc = (href: string, extra: Record<string, unknown> = {}): WriteUpDoc =>
  doc({ type: 'paragraph', content: [{ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href, ...extra } }] }] });
const issues = (input: unknown) => {
  const r = writeUpDoc.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => i.message);
};

describe('writeUpDoc schema', () => {
  it('accepts real editor output unchanged', () => {
    expect(writeUpDoc.parse(EDITOR_OUTPUT)).toEqual(EDITOR_OUTPUT);
    expect(writeUpDoc.parse({ type: 'doc', content: [{ type: 'paragraph' }] })).toEqual({ type: 'doc', content: [{ type: 'paragraph' }] });
  });

  it('strips unknown keys and attrs (the decision written at the top of write-up.ts)', () => {
    const input = {
      type: 'doc',
      content: [
        {
          type: 'paragraph',
          attrs: { textAlign: 'left', style: 'x' },
          content: [{ type: 'text', text: 'a', marks: [{ type: 'link', attrs: { href: 'https://example.com', onclick: 'alert(1)' } }] }],
        },
      ],
    };
    expect(writeUpDoc.parse(input)).toEqual({
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'a', marks: [{ type: 'link', attrs: { href: 'https://example.com' } }] }] },
      ],
    });
  });

  it.each([
    ['an unknown node', doc({ type: 'iframe' } as never)],
    ['an image (not until the media issue)', doc({ type: 'image', attrs: { src: 'https://example.com/x.png' } } as never)],
    ['an unknown mark', doc({ type: 'paragraph', content: [{ type: 'text', text: 'a', marks: [{ type: 'textStyle' } as never] }] })],
    ['a level-1 heading', doc({ type: 'heading', attrs: { level: 1 as never }, content: [] })],
    ['a level-5 heading', doc({ type: 'heading', attrs: { level: 5 as never } })],
    ['text straight in the doc', { type: 'doc', content: [{ type: 'text', text: 'a' }] }],
    ['a paragraph in a paragraph', doc({ type: 'paragraph', content: [para('a') as never] })],
    [
      'a list item not starting with a paragraph',
      doc({ type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'horizontalRule' }] }] }),
    ],
    ['an empty list', doc({ type: 'bulletList', content: [] })],
    ['empty text', doc(para(''))],
    [
      'twice the same mark',
      doc({ type: 'paragraph', content: [{ type: 'text', text: 'a', marks: [{ type: 'bold' }, { type: 'bold' }] }] }),
    ],
    ['not a doc', { type: 'paragraph' }],
    ['not an object', 'hello'],
  ])('rejects %s', (_name, input) => {
    expect(issues(input).length).toBeGreaterThan(0);
  });

  it('says in words which type is not allowed', () => {
    expect(issues(doc({ type: 'iframe' } as never))).toEqual(['A “iframe” is not allowed here']);
    expect(issues(doc({ type: 'paragraph', content: [{ type: 'text', text: 'a', marks: [{ type: 'highlight' } as never] }] }))).toEqual([
      'The formatting “highlight” is not allowed here',
    ]);
  });

  // OWASP XSS Filter Evasion Cheat Sheet (scheme variants); relative and other schemes: our rule (http, https, mailto only).
  it.each([
    'javascript:alert(1)',
    'JaVaScRiPt:alert(1)',
    'jav\tascript:alert(1)',
    'jav&#x09;ascript:alert(1)',
    ' javascript:alert(1)',
    '\u0001javascript:alert(1)',
    'data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==',
    'vbscript:msgbox(1)',
    '//evil.example/x',
    '/relative',
    'ftp://example.com/file',
    'https://',
  ])('rejects the link %j', (href) => {
    expect(issues(linkDoc(href))).toContain('Links must be full http, https or mailto addresses');
  });

  it.each(['https://example.com/a?b=c#d', 'http://example.com', 'mailto:someone@example.com'])('accepts the link %s', (href) => {
    expect(issues(linkDoc(href))).toEqual([]);
  });

  it('limits text to 100,000 characters (boundary)', () => {
    const max = WRITE_UP_LIMITS.maxTextChars;
    expect(issues(doc(para('a'.repeat(max))))).toEqual([]);
    expect(issues(doc(para('a'.repeat(max + 1))))).toEqual([
      'The write-up is too long: at most 100,000 characters of text (this one has 100,001)',
    ]);
  });

  it('limits the number of nodes to 5,000 (boundary, the doc counts)', () => {
    const paragraphs = (n: number) => ({ type: 'doc', content: Array.from({ length: n }, () => ({ type: 'paragraph' })) });
    expect(issues(paragraphs(WRITE_UP_LIMITS.maxNodes - 1))).toEqual([]);
    expect(issues(paragraphs(WRITE_UP_LIMITS.maxNodes))).toEqual([
      'The write-up has too many parts: at most 5,000 paragraphs, list items and pieces of text',
    ]);
  });

  it('limits nesting to 30 levels (boundary), and a very deep document fails fast without overflowing the stack', () => {
    const nested = (levels: number) => {
      let node: unknown = { type: 'paragraph' };
      for (let i = 0; i < levels; i++) node = { type: 'blockquote', content: [node] };
      return { type: 'doc', content: [node] };
    };
    // doc (1) + 28 quotes + paragraph = 30 levels.
    expect(issues(nested(28))).toEqual([]);
    expect(issues(nested(29))).toEqual(['The write-up is nested too deeply: at most 30 levels of lists and quotes inside each other']);
    expect(issues(nested(100_000))).toHaveLength(1);
  });
});

describe('writeUpText', () => {
  it('gives one line per block and keeps hard breaks', () => {
    expect(writeUpText(EDITOR_OUTPUT)).toBe('Brakes\nSome bold and link\nnext\none\nthree\nx = 1\nq\nusec');
    expect(writeUpText({ type: 'doc' })).toBe('');
  });
});

describe('renderWriteUp', () => {
  it('keeps allowed formatting intact', () => {
    expect(renderWriteUp(EDITOR_OUTPUT)).toBe(
      '<h2>Brakes</h2><p>Some <strong>bold</strong> and <a rel="noopener noreferrer nofollow" href="https://example.com/x">link</a><br />next</p>' +
        '<ul><li><p>one</p></li></ul><ol start="3"><li><p>three</p></li></ol><pre><code>x = 1</code></pre>' +
        '<blockquote><p>q</p></blockquote><hr /><p><u>u</u><s>s</s><em>e</em><code>c</code></p>',
    );
  });

  it('renders an empty write-up as no HTML, and drops target and class from links', () => {
    expect(renderWriteUp({ type: 'doc' })).toBe('');
    expect(renderWriteUp(linkDoc('https://example.com/', { target: '_blank', class: 'x', rel: 'opener' }))).toBe(
      '<p><a rel="noopener noreferrer nofollow" href="https://example.com/">click</a></p>',
    );
  });
});

// OWASP XSS Filter Evasion Cheat Sheet vectors (and the brief's mXSS vector).
const PAYLOADS = [
  '<script>alert(1)</script>',
  '<SCRIPT SRC=https://xss.example/xss.js></SCRIPT>',
  '<img src=x onerror=alert(1)>',
  '<IMG SRC="javascript:alert(\'XSS\');">',
  '<IMG SRC=JaVaScRiPt:alert(1)>',
  '<IMG SRC="jav&#x09;ascript:alert(1);">',
  '<IMG SRC="jav&#x0A;ascript:alert(1);">',
  '<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#49;&#41;>',
  '<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x31&#x29>',
  '<svg/onload=alert(1)>',
  '<iframe src=javascript:alert(1)></iframe>',
  '<a href="JaVaScRiPt:alert(1)">x</a>',
  '<a href=" &#14;  javascript:alert(1)">x</a>',
  '<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>',
  '<a href="vbscript:msgbox(1)">x</a>',
  '<body onload=alert(1)>',
  '<div style="background:url(javascript:alert(1))">x</div>',
  '"><script>alert(1)</script>',
  "'><img src=x onerror=alert(1)>",
  '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>',
  '<<SCRIPT>alert(1);//<</SCRIPT>',
  '<SCRIPT/XSS SRC="https://xss.example/xss.js"></SCRIPT>',
  '<BODY ONLOAD=alert(1)>',
  '<INPUT TYPE="IMAGE" SRC="javascript:alert(1);">',
  '<STYLE>li {list-style-image: url("javascript:alert(1)");}</STYLE><UL><LI>x</br>',
  '<META HTTP-EQUIV="refresh" CONTENT="0;url=javascript:alert(1);">',
  '<TABLE BACKGROUND="javascript:alert(1)">',
  '<OBJECT TYPE="text/x-scriptlet" DATA="https://xss.example/scriptlet.html"></OBJECT>',
  '<a href="&#1;javascript:alert(1)">x</a>',
  '<a href="java\0script:alert(1)">x</a>',
  '<p onmouseover="alert(1)">x</p>',
  '<noscript><p title="</noscript><img src=x onerror=alert(1)>">',
];

const win = new Window({
  settings: {
    disableJavaScriptEvaluation: true,
    disableJavaScriptFileLoading: true,
    disableCSSFileLoading: true,
    disableIframePageLoading: true,
  },
});
afterAll(async () => {
  await win.happyDOM.close();
});

const TAGS = new Set(['P', 'H2', 'H3', 'H4', 'UL', 'OL', 'LI', 'BLOCKQUOTE', 'PRE', 'CODE', 'HR', 'BR', 'STRONG', 'EM', 'S', 'U', 'A']);
const ATTRS = new Set(['href', 'rel', 'start', 'type']);

/** The output has no script, no handler and no dangerous URL, in the markup or once entities are decoded by a parser. */
function expectSafe(html: string): void {
  expect(html).not.toMatch(/<script/i);
  // No on… attribute name in any tag (quoted values are text, so they are blanked first).
  for (const tag of html.match(/<[^>]*>/g) ?? []) expect(tag.replace(/"[^"]*"|'[^']*'/g, '""')).not.toMatch(/[\s/]on[a-z]+\s*=/i);
  const tpl = win.document.createElement('template');
  tpl.innerHTML = html;
  for (const el of tpl.content.querySelectorAll('*')) {
    expect(TAGS).toContain(el.tagName);
    for (const attr of Array.from(el.attributes)) {
      expect(ATTRS).toContain(attr.name);
      // Browsers ignore whitespace and control characters inside a scheme.
      // eslint-disable-next-line no-control-regex -- those characters are the point
      const value = (attr.value ?? '').replace(/[\u0000-\u0020\u007f-\u00a0]/g, '').toLowerCase();
      expect(value).not.toMatch(/^(javascript|data|vbscript):/);
      if (attr.name === 'href') expect(value).toMatch(/^(https?|mailto):/);
    }
  }
}

describe('XSS payloads never reach readers', () => {
  it.each(PAYLOADS)('as text: %s', (payload) => {
    const html = renderWriteUp(
      doc(
        para(payload),
        { type: 'heading', attrs: { level: 3 }, content: [{ type: 'text', text: payload }] },
        { type: 'codeBlock', content: [{ type: 'text', text: payload }] },
      ),
    );
    expectSafe(html);
    // Text stays text: escaped, so the reader sees what was typed.
    expect(html).toContain('&lt;');
  });

  // Hand-built documents skip the schema: the renderer (Tiptap's check and the sanitiser) must hold alone.
  it.each(
    PAYLOADS.concat([
      'javascript:alert(1)',
      'JAVASCRIPT:alert(1)',
      'jav\tascript:alert(1)',
      'jav&#x09;ascript:alert(1)',
      'data:text/html,<script>alert(1)</script>',
      'vbscript:msgbox(1)',
    ]),
  )('as a link href: %s', (payload) => {
    expectSafe(renderWriteUp(linkDoc(payload)));
  });

  it.each(PAYLOADS)('as attrs: %s', (payload) => {
    const hostile = {
      type: 'doc',
      content: [
        { type: 'heading', attrs: { level: `2 ${payload}` }, content: [{ type: 'text', text: 'x' }] },
        { type: 'codeBlock', attrs: { language: payload }, content: [{ type: 'text', text: 'x' }] },
        { type: 'orderedList', attrs: { start: payload, type: payload }, content: [{ type: 'listItem', content: [para('x')] }] },
        {
          type: 'paragraph',
          content: [
            {
              type: 'text',
              text: 'x',
              marks: [
                { type: 'link', attrs: { href: 'https://example.com/', target: payload, rel: payload, class: payload, title: payload } },
              ],
            },
          ],
        },
      ],
    } as unknown as WriteUpDoc;
    expectSafe(renderWriteUp(hostile));
  });

  it.each(PAYLOADS)('as raw HTML straight into the sanitiser: %s', (payload) => {
    expectSafe(sanitizeWriteUpHtml(payload));
    expectSafe(sanitizeWriteUpHtml(`<p><a href="https://example.com/">${payload}</a></p>`));
  });

  it('keeps the sanitiser from passing safe formatting it is given', () => {
    expect(
      sanitizeWriteUpHtml(
        '<h2 class="x" style="color:red">T</h2><p><strong>b</strong> <a href="mailto:a@example.com" target="_blank">m</a></p><ol start="2" type="a"><li>x</li></ol><ol start="2x" type="disc"><li>y</li></ol>',
      ),
    ).toBe(
      '<h2>T</h2><p><strong>b</strong> <a href="mailto:a@example.com" rel="noopener noreferrer nofollow">m</a></p><ol start="2" type="a"><li>x</li></ol><ol><li>y</li></ol>',
    );
  });
});

describe('pictures in the write-up', () => {
  it("keeps only this site's media addresses in <img>, and drops pictures with any other source", async () => {
    const { sanitizeWriteUpHtml } = await import('../../server/services/write-up-html');
    const sha = 'c'.repeat(64);
    const ok = sanitizeWriteUpHtml(
      `<img src="/files/4/${sha}/w960.webp" srcset="/files/4/${sha}/w320.webp 320w, https://evil.example/x.webp 960w" alt="Bench" width="960" height="480" onerror="alert(1)" style="x">`,
    );
    expect(ok).toBe(
      `<img src="/files/4/${sha}/w960.webp" srcset="/files/4/${sha}/w320.webp 320w" width="960" height="480" alt="Bench" sizes="(min-width: 64rem) 68ch, 100vw" loading="lazy" decoding="async" />`,
    );
    for (const src of [
      'https://evil.example/a.png',
      'javascript:alert(1)',
      'data:image/png;base64,AAAA',
      '//evil.example/a.png',
      '/files/../etc/passwd',
    ])
      expect(sanitizeWriteUpHtml(`<p>a</p><img src="${src}" alt="x">`), src).toBe('<p>a</p>');
  });

  it('accepts a mediaImage node and refuses one with a foreign src', () => {
    const sha = 'd'.repeat(64);
    const good = { type: 'doc', content: [{ type: 'mediaImage', attrs: { mediaId: 3, alt: 'Hub', src: `/files/3/${sha}/original.png` } }] };
    expect(writeUpDoc.safeParse(good).success).toBe(true);
    const bad = { type: 'doc', content: [{ type: 'mediaImage', attrs: { mediaId: 3, alt: 'Hub', src: 'https://evil.example/a.png' } }] };
    expect(writeUpDoc.safeParse(bad).success).toBe(false);
  });
});
