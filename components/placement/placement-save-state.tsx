/**
 * Where the editor says how saving goes: the one-line status under the mirror's name, and the
 * conflict panel (someone else saved first: both versions and the two choices) with the server's
 * sentence when a save was refused.
 */
import { Notice } from '@/components/ui/notice';
import { AppText } from '@/components/ui/text';
import type { PlacementConflict, PlacementProblem } from '@/hooks/use-placement-writes';
import type { CatalogueItemDto } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { PlacementConflictNotice } from './placement-conflict';

export interface SaveStatusProps {
  canEdit: boolean;
  dirty: boolean;
  saving: boolean;
  error: string | null;
  conflict: boolean;
  /** No connection: a save waits on the device until there is one. */
  offline?: boolean;
}

/** The sentence for where this mirror's saving stands. */
export function saveStatusText({ dirty, saving, error, conflict, offline }: Omit<SaveStatusProps, 'canEdit'>): string {
  if (saving && offline) return 'Offline: kept on this device, sent when the connection returns.';
  if (saving) return 'Saving…';
  if (conflict) return 'Not saved: changed elsewhere.';
  if (error) return 'Not saved.';
  return dirty ? 'Unsaved changes; saving shortly.' : 'All changes saved.';
}

export function SaveStatus(p: SaveStatusProps) {
  if (!p.canEdit) return null;
  return (
    <AppText variant="small" tone={p.error || p.conflict ? 'stop' : 'muted'} testID="placement-save-status" aria-live="polite">
      {saveStatusText(p)}
    </AppText>
  );
}

export interface EditorConflictPanelProps {
  conflict: PlacementConflict | null;
  problem: PlacementProblem | null;
  units: UnitSystem;
  catalogue: readonly CatalogueItemDto[];
  onKeepMine: () => void;
  onUseTheirs: () => void;
}

export function EditorConflictPanel({ conflict, problem, units, catalogue, onKeepMine, onUseTheirs }: EditorConflictPanelProps) {
  return (
    <>
      {conflict ? (
        <PlacementConflictNotice
          conflict={conflict}
          units={units}
          catalogue={catalogue}
          onKeepMine={onKeepMine}
          onUseTheirs={onUseTheirs}
        />
      ) : null}
      {problem?.message ? (
        <Notice tone="stop" testID="placement-error">
          {problem.message}
        </Notice>
      ) : null}
    </>
  );
}
