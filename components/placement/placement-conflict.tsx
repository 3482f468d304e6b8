/**
 * The one conflict flow for a mirror, shown by the editor and by the plan: the server's sentence
 * (someone else saved first), both versions of the fields the person changed, and the two choices.
 */
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import type { PlacementConflict, PlacementEdits } from '@/hooks/use-placement-writes';
import type { CatalogueItemDto } from '@/shared/schemas';
import { formatAngle, formatLength, type UnitSystem } from '@/shared/units';
import { mirrorSizeText } from './mirror-text';

export interface PlacementConflictNoticeProps {
  conflict: PlacementConflict;
  units: UnitSystem;
  catalogue: readonly CatalogueItemDto[];
  /** Names the mirror when shown outside its editor (on the plan). */
  label?: string;
  onKeepMine: () => void;
  onUseTheirs: () => void;
}

export function PlacementConflictNotice({ conflict, units, catalogue, label, onKeepMine, onUseTheirs }: PlacementConflictNoticeProps) {
  return (
    <View style={styles.section} testID="placement-conflict">
      <Notice tone="stop">{label ? `${label}: ${conflict.message}` : conflict.message}</Notice>
      <AppText testID="placement-conflict-mine-values">{`Yours, not saved: ${valuesText(conflict.mine, units, catalogue)}.`}</AppText>
      <AppText testID="placement-conflict-theirs-values">{`Saved now: ${valuesText(conflict.theirs, units, catalogue)}.`}</AppText>
      <View style={styles.actions}>
        <Button label="Save mine over it" testID="placement-conflict-keep" onPress={onKeepMine} />
        <Button label="Use the saved values" testID="placement-conflict-theirs" variant="secondary" onPress={onUseTheirs} />
      </View>
    </View>
  );
}

/** A placement's values for the fields in a conflict, in the person's units. */
export function valuesText(v: PlacementEdits, units: UnitSystem, catalogue: readonly CatalogueItemDto[]): string {
  const parts: string[] = [];
  if (v.label !== undefined) parts.push(`label “${v.label}”`);
  if (v.heightM !== undefined) parts.push(`height ${formatLength(v.heightM, units)}`);
  if (v.azimuthRad !== undefined) parts.push(`aim ${formatAngle(v.azimuthRad)}`);
  if (v.tiltDownRad !== undefined) parts.push(`tilt ${formatAngle(v.tiltDownRad)}`);
  if (v.positionM !== undefined) parts.push(`position ${formatLength(v.positionM[0], units)}, ${formatLength(v.positionM[1], units)}`);
  if (v.customMirror) parts.push(`custom mirror ${mirrorSizeText(v.customMirror, units)}`);
  else if (v.catalogueItemId != null)
    parts.push(`mirror ${catalogue.find((c) => c.id === v.catalogueItemId)?.name ?? `#${v.catalogueItemId}`}`);
  if (v.viewerId !== undefined) parts.push(v.viewerId ? `viewer ${v.viewerId}` : 'no viewer');
  if (v.notes !== undefined) parts.push(`notes “${v.notes}”`);
  return parts.length ? parts.join('; ') : 'no fields';
}

const styles = StyleSheet.create({
  section: { gap: spacing.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
});
