import { Badge } from '@/components/ui/badge';
import type { BadgeTone } from '@/components/ui/badge';
import { PROJECT_STATE_LABELS, type ProjectState } from '@/shared/schemas';

/** One colour per state, so the queue, the project list and the job screen agree at a glance. */
export const STATE_TONES: Record<ProjectState, BadgeTone> = {
  drawing_up: 'neutral',
  with_reviewer: 'beacon',
  approved: 'go',
  returned: 'stop',
};

/** The job's review state: the words from PROJECT_STATE_LABELS in the state's colour. */
export function StateBadge({ state, testID }: { state: ProjectState; testID?: string }) {
  return <Badge label={PROJECT_STATE_LABELS[state]} tone={STATE_TONES[state]} testID={testID} />;
}
