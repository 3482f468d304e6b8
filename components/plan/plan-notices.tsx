/**
 * The sentences over the top of the plan: a failed plan save (with Try again when it makes sense),
 * each mirror's conflict that its open editor is not already showing (so a drag's conflict is never
 * silent), and the current tool's sentence.
 */
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Notice } from '@/components/ui';
import { PlacementConflictNotice } from '@/components/placement/placement-conflict';
import { spacing } from '@/constants/theme';
import type { PlacementWrites } from '@/hooks/use-placement-writes';
import type { PlanSaveProblem } from '@/hooks/use-plan-edits';
import type { CatalogueItemDto, PlacementDto } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';

export interface PlanNoticesProps {
  saveProblem: PlanSaveProblem | null;
  onDismissSaveProblem: () => void;
  writes: PlacementWrites;
  placements: readonly PlacementDto[];
  /** The mirror whose editor is open: its conflict shows there instead. */
  editorOpenFor: number | null;
  toolProblem: string | null;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
}

export function PlanNotices(p: PlanNoticesProps) {
  return (
    <>
      {p.saveProblem ? (
        <Notice tone="stop" testID="plan-save-error">
          <AppText variant="bodyStrong" tone="stop">
            {p.saveProblem.message}
          </AppText>
          <View style={styles.row}>
            {p.saveProblem.retry ? <Button label="Try again" testID="plan-save-retry" onPress={p.saveProblem.retry} /> : null}
            <Button label="Dismiss" variant="quiet" testID="plan-save-dismiss" onPress={p.onDismissSaveProblem} />
          </View>
        </Notice>
      ) : null}
      {Object.entries(p.writes.conflicts)
        .filter(([id]) => Number(id) !== p.editorOpenFor)
        .map(([id, conflict]) => (
          <PlacementConflictNotice
            key={id}
            conflict={conflict}
            units={p.units}
            catalogue={p.catalogue}
            label={p.placements.find((x) => x.id === Number(id))?.label}
            onKeepMine={() => p.writes.keepMine(Number(id))}
            onUseTheirs={() => p.writes.useTheirs(Number(id))}
          />
        ))}
      {p.toolProblem ? (
        <Notice tone="stop" testID="plan-tool-error">
          {p.toolProblem}
        </Notice>
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: spacing.sm, marginTop: spacing.xs },
});
