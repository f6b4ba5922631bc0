import { mergeAttributes, Node } from '@tiptap/core';

/**
 * The write-up's picture: a stored photo referred to by id, with its alt text. The server fills in
 * `src`, `srcset`, `width` and `height` from the media table when it renders (renderWriteUp); the
 * editor keeps `src` for its preview. Pictures are blocks of their own, never inside a paragraph.
 */
export const MediaImage = Node.create({
  name: 'mediaImage',
  group: 'block',
  atom: true,
  draggable: true,
  selectable: true,
  addAttributes() {
    return {
      mediaId: {
        default: null,
        parseHTML: (el) => Number(el.getAttribute('data-media-id')) || null,
        renderHTML: (a) => ({ 'data-media-id': a.mediaId }),
      },
      alt: { default: '' },
      src: { default: null },
      srcset: { default: null, rendered: true },
      width: { default: null },
      height: { default: null },
    };
  },
  parseHTML() {
    return [{ tag: 'img[data-media-id]' }];
  },
  renderHTML({ HTMLAttributes }) {
    return ['img', mergeAttributes(HTMLAttributes, { loading: 'lazy', decoding: 'async', sizes: '(min-width: 64rem) 68ch, 100vw' })];
  },
});
