import { useEditorState, type Editor } from '@tiptap/react';
import { useRef, useState, type KeyboardEvent } from 'react';

interface ToolbarProps {
  editor: Editor;
  controls: string;
  onLink: () => void;
  onPicture: () => void;
}

interface Tool {
  key: string;
  label: string;
  /** What the button shows; the label is its accessible name. */
  face: string;
  faceClass?: string;
  pressed?: boolean;
  disabled?: boolean;
  run: () => void;
}

/**
 * The write-up's formatting buttons as one toolbar: Tab enters and leaves it, arrow keys, Home and
 * End move between buttons (one tab stop), and toggles say whether they are on.
 */
export function WriteUpToolbar({ editor, controls, onLink, onPicture }: ToolbarProps) {
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      strike: e.isActive('strike'),
      code: e.isActive('code'),
      h2: e.isActive('heading', { level: 2 }),
      h3: e.isActive('heading', { level: 3 }),
      h4: e.isActive('heading', { level: 4 }),
      bulletList: e.isActive('bulletList'),
      orderedList: e.isActive('orderedList'),
      blockquote: e.isActive('blockquote'),
      link: e.isActive('link'),
      canUndo: e.can().undo(),
      canRedo: e.can().redo(),
    }),
  });
  const [active, setActive] = useState(0);
  const buttons = useRef<Array<HTMLButtonElement | null>>([]);
  const chain = () => editor.chain().focus();

  const tools: Tool[] = [
    { key: 'bold', label: 'Bold', face: 'B', faceClass: 'font-bold', pressed: state.bold, run: () => chain().toggleBold().run() },
    {
      key: 'italic',
      label: 'Italic',
      face: 'I',
      faceClass: 'italic font-serif',
      pressed: state.italic,
      run: () => chain().toggleItalic().run(),
    },
    {
      key: 'strike',
      label: 'Struck through',
      face: 'S',
      faceClass: 'line-through',
      pressed: state.strike,
      run: () => chain().toggleStrike().run(),
    },
    {
      key: 'code',
      label: 'Code or part number',
      face: '</>',
      faceClass: 'font-mono',
      pressed: state.code,
      run: () => chain().toggleCode().run(),
    },
    { key: 'h2', label: 'Heading', face: 'H2', pressed: state.h2, run: () => chain().toggleHeading({ level: 2 }).run() },
    { key: 'h3', label: 'Subheading', face: 'H3', pressed: state.h3, run: () => chain().toggleHeading({ level: 3 }).run() },
    { key: 'h4', label: 'Minor heading', face: 'H4', pressed: state.h4, run: () => chain().toggleHeading({ level: 4 }).run() },
    { key: 'bullets', label: 'Bulleted list', face: '• List', pressed: state.bulletList, run: () => chain().toggleBulletList().run() },
    { key: 'numbers', label: 'Numbered list', face: '1. List', pressed: state.orderedList, run: () => chain().toggleOrderedList().run() },
    { key: 'quote', label: 'Quotation', face: '“ ”', pressed: state.blockquote, run: () => chain().toggleBlockquote().run() },
    { key: 'link', label: state.link ? 'Change the link' : 'Add a link', face: 'Link', pressed: state.link, run: onLink },
    { key: 'picture', label: 'Add a picture', face: 'Picture', run: onPicture },
    { key: 'undo', label: 'Undo', face: '↶', disabled: !state.canUndo, run: () => chain().undo().run() },
    { key: 'redo', label: 'Redo', face: '↷', disabled: !state.canRedo, run: () => chain().redo().run() },
  ];

  const move = (event: KeyboardEvent<HTMLDivElement>) => {
    const last = tools.length - 1;
    const next = { ArrowRight: active + 1, ArrowLeft: active - 1, Home: 0, End: last }[event.key];
    if (next === undefined) return;
    event.preventDefault();
    const index = (next + tools.length) % tools.length;
    setActive(index);
    buttons.current[index]?.focus();
  };

  return (
    <div
      role="toolbar"
      aria-label="Write-up formatting"
      aria-controls={controls}
      onKeyDown={move}
      className="flex flex-wrap gap-1 border-b border-rule bg-paper-2 p-1.5"
    >
      {tools.map((tool, i) => (
        <button
          key={tool.key}
          ref={(el) => {
            buttons.current[i] = el;
          }}
          type="button"
          tabIndex={i === active ? 0 : -1}
          aria-label={tool.label}
          title={tool.label}
          aria-pressed={tool.pressed === undefined ? undefined : tool.pressed}
          aria-disabled={tool.disabled || undefined}
          onFocus={() => setActive(i)}
          onClick={() => (tool.disabled ? undefined : tool.run())}
          className={`min-h-11 min-w-11 border px-2 text-[15px] aria-disabled:opacity-50 aria-pressed:border-ink aria-pressed:bg-ink aria-pressed:text-paper ${tool.pressed ? '' : 'border-transparent text-ink hover:border-rule hover:bg-card'} ${tool.faceClass ?? ''}`}
        >
          <span aria-hidden="true">{tool.face}</span>
        </button>
      ))}
    </div>
  );
}
