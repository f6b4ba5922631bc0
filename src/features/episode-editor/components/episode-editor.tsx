import { useEffect, useMemo, type ReactNode } from 'react';
import { Link } from 'react-router';
import { paths } from '../../../shared/paths';
import { DEFAULT_VIDEO_LINK_PATTERN, type Build } from '../../../shared/schemas/builds';
import type { Episode } from '../../../shared/schemas/episodes';
import { useFigures } from '../api/get-figures';
import { useAutosave } from '../hooks/use-autosave';
import { useLeaveWarning } from '../hooks/use-leave-warning';
import { DRAFT_FIELDS, type DraftField, type EditorDraft } from '../model/draft';
import { convertField } from '../model/to-update';
import { CautionPreview } from './caution-preview';
import { ChaptersPanel } from './chapters/chapters-panel';
import { ConflictNotice } from './conflict-notice';
import { EpisodeFields } from './episode-fields';
import { FiguresPanel } from './figures/figures-panel';
import { LeaveDialog } from './leave-dialog';
import { OpenItemsPanel } from './open-items/open-items-panel';
import { PublishControls } from './publish/publish-controls';
import { DisclosurePanel } from './publish/disclosure-panel';
import { disclosureLine } from '../../../shared/disclosure';
import type { DisclosureJson } from '../../../shared/schemas/sponsors';
import { RestoredNotice, SetAsideNotice } from './restore-notice';
import { SaveStatusLine } from './save-status';
import { WriteUpEditor } from './write-up/write-up-editor';

interface EpisodeEditorProps {
  /** The episode as the query cache has it; the editor starts from the first one it gets. */
  episode: Episode;
  /** The episode's build; the editor works without it (no systems, the default link pattern). */
  build: Build | undefined;
  /** The parts panel, composed by the route (another feature's), shown full width under the rest. */
  parts?: ReactNode;
  /** The episode's disclosure as its saved lines stand (from the parts feature, composed by the route); undefined while loading. */
  disclosure?: DisclosureJson | null;
}

/** What each field's input would send, or why it cannot be sent yet; the server's 400 messages win. */
function fieldErrors(draft: EditorDraft, rejected: Partial<Record<DraftField, string>>): Partial<Record<DraftField, string>> {
  const out: Partial<Record<DraftField, string>> = {};
  for (const field of DRAFT_FIELDS) {
    if (field === 'chapters') continue;
    const result = convertField(field, draft);
    if (!result.ok) out[field] = result.message;
  }
  return { ...out, ...rejected };
}

/** The episode editor: fields, write-up, chapters, parts, figures, open items, publishing, with autosave throughout. */
export function EpisodeEditor({ episode, build, parts, disclosure }: EpisodeEditorProps) {
  const autosave = useAutosave(episode);
  const { draft, change, snapshot, observe } = autosave;
  const { blocker, asking } = useLeaveWarning(autosave.hasUnsaved, autosave.saveNow);

  // A refetch that shows a newer version (another tab saved) is taken in, or turned into the choice.
  useEffect(() => observe(episode), [episode, observe]);

  const errors = useMemo(() => fieldErrors(draft, snapshot.rejected), [draft, snapshot.rejected]);
  const video = convertField('videoUrl', draft);
  const videoUrl = video.ok && typeof video.value === 'string' ? video.value : null;
  const duration = convertField('duration', draft);
  const durationSeconds = duration.ok && typeof duration.value === 'number' ? duration.value : null;
  const server = snapshot.server;
  const figures = useFigures(server.id).data?.items;
  const figureSystemKeys = useMemo(() => (figures ?? []).flatMap((f) => (f.system ? [f.system.key] : [])), [figures]);
  const heading = draft.title.trim() || 'Untitled episode';

  return (
    <article aria-labelledby="episode-editor-heading" className="min-w-0">
      <title>{`Editing: ${heading} — Rivet & Reel`}</title>
      <meta name="robots" content="noindex" />
      <p className="font-condensed text-sm font-semibold tracking-label text-slate uppercase">
        {build ? (
          <Link to={paths.build(build.owner.handle, build.slug)} className="text-ink-2 underline underline-offset-2">
            {build.title}
          </Link>
        ) : (
          'Build'
        )}{' '}
        / Episode {server.number}
        {server.status === 'published' && build ? (
          <>
            {' '}
            ·{' '}
            <Link to={paths.episode(build.owner.handle, build.slug, server.slug)} className="text-ink-2 underline underline-offset-2">
              View as readers see it
            </Link>
          </>
        ) : null}
      </p>
      <p className="mt-3 label-condensed text-oxide">Episode editor</p>
      <h1 id="episode-editor-heading" className="mt-1 font-serif text-[27px] leading-tight font-bold break-words md:text-[38px]">
        {heading}
      </h1>

      <div className="sticky top-0 z-10 mt-3 bg-paper py-2">
        <SaveStatusLine snapshot={snapshot} />
      </div>

      <div className="mt-3 space-y-3">
        {snapshot.conflict ? (
          <ConflictNotice current={snapshot.conflict} onLoadSaved={autosave.loadSaved} onKeepMine={autosave.keepMine} />
        ) : null}
        {snapshot.setAside ? (
          <SetAsideNotice setAside={snapshot.setAside} onRestore={autosave.restoreSetAside} onDiscard={autosave.discardSetAside} />
        ) : null}
        {snapshot.restoredFields.length ? <RestoredNotice fields={snapshot.restoredFields} onDismiss={autosave.dismissRestored} /> : null}
      </div>

      <div className="mt-6 grid gap-10 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-10">
          <EpisodeFields draft={draft} errors={errors} onChange={change} />
          <WriteUpEditor
            buildId={server.buildId}
            value={draft.writeUp}
            onChange={(writeUp) => change({ writeUp })}
            error={snapshot.rejected.writeUp}
          />
          <ChaptersPanel
            rows={draft.chapters}
            onChange={(chapters) => change({ chapters })}
            systems={build?.systems ?? []}
            durationSeconds={durationSeconds}
            videoUrl={videoUrl}
            linkPattern={build?.videoLinkPattern ?? DEFAULT_VIDEO_LINK_PATTERN}
            serverMessages={snapshot.rejectedRows}
            disclosure={disclosure ? disclosureLine(disclosure) : null}
          />
          <FiguresPanel episodeId={server.id} systems={build?.systems ?? []} />
        </div>
        <aside aria-label="Publishing, safety and open items" className="min-w-0 space-y-10">
          <PublishControls episode={server} commit={autosave.commit} />
          <DisclosurePanel
            disclosure={disclosure}
            confirmed={draft.videoDisclosureConfirmed}
            onChange={(videoDisclosureConfirmed) => change({ videoDisclosureConfirmed })}
          />
          <CautionPreview
            raisedVehicle={draft.raisedVehicle}
            rows={draft.chapters}
            figureSystemKeys={figureSystemKeys}
            systems={build?.systems}
            serverNeedsCaution={server.needsCaution}
          />
          <OpenItemsPanel buildId={server.buildId} episodeId={server.id} />
        </aside>
      </div>
      {parts ? <div className="mt-10 min-w-0">{parts}</div> : null}
      <LeaveDialog blocker={blocker} open={asking} />
    </article>
  );
}
