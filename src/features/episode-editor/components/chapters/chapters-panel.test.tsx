// @vitest-environment happy-dom
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEFAULT_SYSTEMS } from '../../../../shared/schemas/builds';
import { emptyChapterRow, type ChapterRow } from '../../model/draft';
import { ChaptersPanel } from './chapters-panel';

function row(start: string, title: string): ChapterRow {
  return { ...emptyChapterRow(), start, title };
}

function Harness({
  initial = [],
  videoUrl = null,
  onRows,
}: {
  initial?: ChapterRow[];
  videoUrl?: string | null;
  onRows?: (rows: ChapterRow[]) => void;
}) {
  const [rows, setRows] = useState<ChapterRow[]>(initial);
  return (
    <ChaptersPanel
      rows={rows}
      onChange={(next) => {
        setRows(next);
        onRows?.(next);
      }}
      systems={DEFAULT_SYSTEMS}
      durationSeconds={null}
      videoUrl={videoUrl}
      linkPattern="t={seconds}"
    />
  );
}

const chapterItems = () => screen.getAllByRole('listitem').filter((li) => /^Chapter \d+$/.test(li.getAttribute('aria-label') ?? ''));

afterEach(() => {
  cleanup();
  vi.restoreAllMocks();
});

describe('ChaptersPanel', () => {
  it('turns a pasted block into rows and lists the lines it left out', () => {
    render(<Harness />);
    fireEvent.click(screen.getByRole('button', { name: 'Paste a block' }));
    fireEvent.change(screen.getByLabelText('Chapters block'), {
      target: { value: '0:00 Recap\n(1:12) Freeing the piston\nnot a chapter\n4:05 – Seals and dust boot' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Add these chapters' }));

    expect(chapterItems()).toHaveLength(3);
    expect((screen.getByLabelText('Start of chapter 2') as HTMLInputElement).value).toBe('1:12');
    expect((screen.getByLabelText('Title of chapter 2') as HTMLInputElement).value).toBe('Freeing the piston');
    expect((screen.getByLabelText('Title of chapter 3') as HTMLInputElement).value).toBe('Seals and dust boot');
    expect(screen.getByText(/Added 3 chapters; 1 line was left out/)).toBeTruthy();
    expect(screen.getByText(/Line 3 has no start time/)).toBeTruthy();
  });

  it('shows a 5-second chapter’s message on its own row, tied to its start time', () => {
    render(<Harness initial={[row('0:00', 'Recap'), row('1:00', 'Quick look'), row('1:05', 'Caliper off')]} />);
    const start = screen.getByLabelText('Start of chapter 2');
    expect(start.getAttribute('aria-invalid')).toBe('true');
    const describedBy = start.getAttribute('aria-describedby') ?? '';
    const message = document.getElementById(describedBy);
    expect(message?.textContent).toMatch(/Only 5 seconds long/);
    // The message sits inside the second row, and nowhere else.
    expect(within(chapterItems()[1]!).getByText(/Only 5 seconds long/)).toBeTruthy();
    expect(within(chapterItems()[0]!).queryByText(/seconds long/)).toBeNull();
    expect(screen.getByLabelText('Start of chapter 1').getAttribute('aria-invalid')).toBeNull();
  });

  it('adds a row with Enter in the last row and focuses its start time', () => {
    render(<Harness initial={[row('0:00', 'Recap')]} />);
    fireEvent.keyDown(screen.getByLabelText('Title of chapter 1'), { key: 'Enter' });
    expect(chapterItems()).toHaveLength(2);
    expect(document.activeElement).toBe(screen.getByLabelText('Start of chapter 2'));
  });

  it('puts rows in time order when a start time is left', () => {
    const seen: ChapterRow[][] = [];
    render(<Harness initial={[row('0:00', 'Recap'), row('9:48', 'Caliper back on'), row('4:05', 'Seals')]} onRows={(r) => seen.push(r)} />);
    fireEvent.blur(screen.getByLabelText('Start of chapter 3'));
    expect(seen.at(-1)?.map((r) => r.title)).toEqual(['Recap', 'Seals', 'Caliper back on']);
  });

  it('copies the export block to the clipboard and confirms it', async () => {
    const writeText = vi.fn(async () => undefined);
    vi.spyOn(navigator, 'clipboard', 'get').mockReturnValue({ writeText } as unknown as Clipboard);
    render(<Harness initial={[row('0:00', 'Recap'), row('1:12', 'Freeing the piston'), row('1:02:05', 'Road test')]} />);
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Copy for the video description' }));
    });
    // One width throughout once a chapter starts past the hour (exportChapterBlock).
    expect(writeText).toHaveBeenCalledWith('0:00:00 Recap\n0:01:12 Freeing the piston\n1:02:05 Road test');
    expect(screen.getByText(/Copied 3 chapters to the clipboard/)).toBeTruthy();
  });

  it('refuses to copy a block the video host would not show, and marks why on the rows', async () => {
    render(<Harness initial={[row('0:30', 'Recap'), row('1:12', 'Freeing the piston')]} />);
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Copy for the video description' }));
    });
    expect(screen.getByText(/Not copied/)).toBeTruthy();
    expect(within(chapterItems()[0]!).getByText(/first chapter must start at 0:00/)).toBeTruthy();
    expect(within(chapterItems()[1]!).getByText(/add 1 more/)).toBeTruthy();
  });

  it('falls back to a selected text box when there is no clipboard', async () => {
    vi.spyOn(navigator, 'clipboard', 'get').mockReturnValue(undefined as unknown as Clipboard);
    render(<Harness initial={[row('0:00', 'Recap'), row('1:12', 'Freeing the piston'), row('4:05', 'Seals')]} />);
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Copy for the video description' }));
    });
    const box = screen.getByLabelText('Chapters block for the video description') as HTMLTextAreaElement;
    expect(box.value).toBe('0:00 Recap\n1:12 Freeing the piston\n4:05 Seals');
    expect(document.activeElement).toBe(box);
  });

  it('links each chapter to its moment of the video', () => {
    render(<Harness initial={[row('1:12', 'Freeing the piston')]} videoUrl="https://video.example/watch?v=abc" />);
    expect(screen.getByRole('link').getAttribute('href')).toBe('https://video.example/watch?v=abc&t=72');
  });
});
