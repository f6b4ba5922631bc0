import { EditorContent, useEditor } from '@tiptap/react';
import { useEffect, useId, useRef, useState } from 'react';
import { writeUpExtensionList } from '../../../../shared/write-up-extensions';
import type { WriteUpDoc } from '../../../../shared/write-up';
import { LinkDialog } from './link-dialog';
import { PictureUploads, usePictureUploads } from './picture-uploads';
import { WriteUpToolbar } from './write-up-toolbar';

interface WriteUpEditorProps {
  /** Pictures are stored with the build. */
  buildId: number;
  value: WriteUpDoc;
  onChange: (doc: WriteUpDoc) => void;
  /** The server's message about the write-up, when it refused one. */
  error?: string;
}

// The write-up as readers will see it (LOOK.md): Merriweather 17 px, 1.75 line height, about 68
// characters wide. Tiptap's own CSS is not injected (CSP forbids inline <style>), so the few rules
// ProseMirror needs are here as classes.
const proseClass = [
  'min-h-64 max-w-measure px-4 py-3 font-serif text-[17px] leading-[1.75] text-ink whitespace-pre-wrap break-words outline-none',
  '[&_h2]:mt-6 [&_h2]:text-[22px] [&_h2]:font-bold [&_h3]:mt-5 [&_h3]:text-[19px] [&_h3]:font-bold [&_h4]:mt-4 [&_h4]:font-bold',
  '[&_p]:my-3 [&_ul]:my-3 [&_ul]:list-disc [&_ul]:pl-6 [&_ol]:my-3 [&_ol]:list-decimal [&_ol]:pl-6',
  '[&_blockquote]:my-3 [&_blockquote]:border-l-4 [&_blockquote]:border-rule [&_blockquote]:pl-4 [&_blockquote]:text-ink-2',
  '[&_code]:bg-paper-2 [&_code]:px-1 [&_code]:font-mono [&_code]:text-[15px] [&_pre]:overflow-x-auto [&_pre]:bg-paper-2 [&_pre]:p-3',
  '[&_a]:text-oxide-2 [&_a]:underline',
  '[&_img]:my-3 [&_img]:block [&_img]:h-auto [&_img]:max-w-full [&_img]:border [&_img]:border-rule [&_.ProseMirror-selectednode]:outline-2 [&_.ProseMirror-selectednode]:outline-oxide',
].join(' ');

function contentAttributes(id: string, error: string | undefined): Record<string, string> {
  return {
    id: `${id}-content`,
    role: 'textbox',
    'aria-multiline': 'true',
    'aria-labelledby': `${id}-label`,
    'aria-describedby': error ? `${id}-hint ${id}-error` : `${id}-hint`,
    ...(error ? { 'aria-invalid': 'true' } : {}),
    class: proseClass,
  };
}

/** Files from a drop or a paste go to the uploads; true tells the editor the event is handled. */
function takeFiles(files: FileList | null | undefined, add: (files: File[]) => void): boolean {
  if (!files?.length) return false;
  add([...files]);
  return true;
}

/** The write-up editor: Tiptap with the shared extension list, pictures uploaded to the build's media. */
export function WriteUpEditor({ buildId, value, onChange, error }: WriteUpEditorProps) {
  const id = useId();
  const lastEmitted = useRef<WriteUpDoc>(value);
  const onChangeRef = useRef(onChange);
  const [linkOpen, setLinkOpen] = useState(false);
  const [linkHref, setLinkHref] = useState('');
  const pictures = usePictureUploads(buildId);
  const addPictures = useRef(pictures.add);
  const fileInput = useRef<HTMLInputElement>(null);
  useEffect(() => {
    addPictures.current = pictures.add;
  }, [pictures.add]);

  useEffect(() => {
    onChangeRef.current = onChange;
  }, [onChange]);

  const editor = useEditor({
    extensions: writeUpExtensionList(),
    content: value,
    // Rendered only in the browser: the server sends the editor's loading state instead.
    immediatelyRender: false,
    injectCSS: false,
    editorProps: {
      attributes: contentAttributes(id, error),
      // Pictures dropped or pasted into the text are uploaded, never stored as data in the document.
      handleDrop: (_view, event) => takeFiles((event as DragEvent).dataTransfer?.files, addPictures.current),
      handlePaste: (_view, event) => takeFiles(event.clipboardData?.files, addPictures.current),
    },
    onUpdate: ({ editor: e }) => {
      const doc = e.getJSON() as WriteUpDoc;
      lastEmitted.current = doc;
      onChangeRef.current(doc);
    },
  });

  // The editable element's attributes are fixed at creation; an error arriving later updates them.
  useEffect(() => {
    editor?.setOptions({ editorProps: { attributes: contentAttributes(id, error) } });
  }, [editor, id, error]);

  // A value from outside (loading the saved version, restoring from this device) replaces the text.
  useEffect(() => {
    if (!editor || value === lastEmitted.current) return;
    lastEmitted.current = value;
    editor.commands.setContent(value, { emitUpdate: false });
  }, [editor, value]);

  const openLink = () => {
    if (!editor) return;
    setLinkHref(String(editor.getAttributes('link').href ?? ''));
    setLinkOpen(true);
  };
  const closeLink = () => {
    setLinkOpen(false);
    editor?.commands.focus();
  };

  return (
    <div>
      <p id={`${id}-label`} className="block font-semibold text-ink">
        Write-up
      </p>
      <p id={`${id}-hint`} className="mt-0.5 text-[15px] text-slate">
        What was done in this session, for readers to follow. Headings, lists, quotes, links and pictures (drop or paste them in).
      </p>
      <div
        className={`mt-1.5 border-[1.5px] bg-card ${error ? 'border-oxide-2' : 'border-ink-2'} focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-ink`}
      >
        {editor ? (
          <>
            <WriteUpToolbar editor={editor} controls={`${id}-content`} onLink={openLink} onPicture={() => fileInput.current?.click()} />
            <input
              ref={fileInput}
              type="file"
              accept="image/jpeg,image/png,image/webp,image/avif,image/gif"
              multiple
              hidden
              aria-label="Choose pictures to add"
              data-testid="picture-input"
              onChange={(e) => {
                pictures.add([...(e.target.files ?? [])]);
                e.target.value = '';
              }}
            />
            <PictureUploads uploads={pictures.uploads} editor={editor} onDismiss={pictures.dismiss} />
            <EditorContent editor={editor} />
          </>
        ) : (
          <p role="status" className="min-h-64 px-4 py-3 text-slate">
            Loading the write-up editor…
          </p>
        )}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-[15px] font-semibold text-oxide-2">
          {error}
        </p>
      ) : null}
      <LinkDialog
        open={linkOpen}
        initialHref={linkHref}
        onClose={closeLink}
        onSet={(href) => {
          editor?.chain().focus().extendMarkRange('link').setLink({ href }).run();
          setLinkOpen(false);
        }}
        onRemove={() => {
          editor?.chain().focus().extendMarkRange('link').unsetLink().run();
          setLinkOpen(false);
        }}
      />
    </div>
  );
}
