/**
 * Binds the review to the job screen: the comment threads and their markers on the plan, the
 * one-shot "tap the plan to pin a comment" mode, and the review panel for the details column.
 * The workspace only passes `pinning`, `onPinTap` and `overlay` to the canvas and places `panel`.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import type { PlanView } from '@/components/plan/plan-view';
import type { PlanSelection } from '@/components/plan/plan-types';
import { projectKeys } from '@/hooks/use-projects';
import { reviewKeys, useCommentsQuery } from '@/hooks/use-review';
import type { PlacementDto, ProjectDto } from '@/shared/schemas';
import type { PinChoice } from './comment-form';
import { CommentMarkers } from './comment-markers';
import { threadsOf } from './comment-threads';
import { ReviewPanel } from './review-panel';

export function useReviewPlan({
  project,
  placements,
  selection,
  wide,
}: {
  project: ProjectDto;
  placements: readonly PlacementDto[];
  selection: PlanSelection;
  wide: boolean;
}) {
  const comments = useCommentsQuery(project.id);
  useFollowWithdrawal(project);
  const threads = useMemo(() => threadsOf(comments.data ?? []), [comments.data]);
  const [pinChoice, setPinChoice] = useState<PinChoice>('job');
  const [pinning, setPinning] = useState(false);
  const [pickedPointM, setPickedPointM] = useState<[number, number] | null>(null);

  const selected = selection?.kind === 'placement' ? placements.find((p) => p.id === selection.id) : undefined;
  const onPinTap = (pointM: [number, number]) => {
    setPickedPointM([Math.round(pointM[0] * 100) / 100, Math.round(pointM[1] * 100) / 100]);
    setPinning(false);
  };
  const overlay = (view: PlanView) => (
    <CommentMarkers threads={threads} placements={placements} view={view} pendingPointM={pinChoice === 'point' ? pickedPointM : null} />
  );
  const panel = (
    <ReviewPanel
      project={project}
      placements={placements}
      threads={threads}
      commentsError={comments.error}
      wide={wide}
      comment={{
        selectedPlacement: selected ? { id: selected.id, label: selected.label } : null,
        pickedPointM,
        pinChoice,
        onPinChoice: (c) => {
          setPinChoice(c);
          setPinning(false);
        },
        pickingPoint: pinning,
        onPickPoint: () => setPinning((p) => !p),
        onPosted: () => setPickedPointM(null),
      }}
    />
  );
  return { pinning, onPinTap, overlay, panel };
}

/**
 * A mirror write answers with the project's new version but not its state, while the server
 * withdraws an approval on any change to the content. So when the version moves on an approved
 * job, fetch the job again (the badge, the sentence and the sheet must stop saying "Approved"),
 * and the trail, which has a new event.
 */
function useFollowWithdrawal(project: ProjectDto) {
  const qc = useQueryClient();
  const seen = useRef(project.version);
  useEffect(() => {
    if (project.version === seen.current) return;
    seen.current = project.version;
    void qc.invalidateQueries({ queryKey: reviewKeys.events(project.id) });
    if (project.state === 'approved') void qc.invalidateQueries({ queryKey: projectKeys.detail(project.id) });
  }, [project.id, project.version, project.state, qc]);
}
