import type { Extensions } from '@tiptap/core';
import { StarterKit } from '@tiptap/starter-kit';
import { MediaImage } from './media-image-node';
import { isAllowedWriteUpHref } from './write-up';

// One Tiptap configuration for the editor and the server renderer, so that what the editor lets a
// creator write is exactly what the server can render. @tiptap/core touches no DOM at import time,
// so this module loads in Node; import it only from editor code and the server (it is heavy for
// public pages, which get the server's HTML).

/** The write-up's Tiptap extensions: StarterKit 3 (with its Link and Underline) configured for Rivet & Reel. */
export function writeUpExtensionList(): Extensions {
  return [
    StarterKit.configure({
      // The episode title is the page's h1.
      heading: { levels: [2, 3, 4] },
      link: {
        protocols: [],
        defaultProtocol: 'https',
        // Editing a link should not navigate away from the editor.
        openOnClick: false,
        isAllowedUri: (url) => isAllowedWriteUpHref(url),
        // No target: readers choose how to open links; rel keeps creators' links from passing rank or opener.
        HTMLAttributes: { target: null, rel: 'noopener noreferrer nofollow', class: null },
      },
    }),
    MediaImage,
  ];
}
