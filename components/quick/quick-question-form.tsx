/** The quick question's fields: the kind of spot, who must be seen, and seven measured values in either unit system. */
import { StyleSheet, View } from 'react-native';
import { AppText, Segmented } from '@/components/ui';
import { NumberField } from '@/components/ui/number-field';
import { spacing } from '@/constants/theme';
import { QUICK_LIMITS, type QuickField, type QuickQuestion, type SpotKind, type WhoKind } from '@/shared/quick';
import type { UnitSystem } from '@/shared/units';

/** The form's state: a field is null while it is empty or unreadable. */
export type QuickDraft = Pick<QuickQuestion, 'spot' | 'who'> & Record<QuickField, number | null>;

const SPOT_OPTIONS = [
  { value: 'corner', label: 'Corner', testID: 'quick-spot-corner' },
  { value: 'aisle', label: 'Aisle', testID: 'quick-spot-aisle' },
  { value: 'doorway', label: 'Doorway', testID: 'quick-spot-doorway' },
] as const satisfies readonly { value: SpotKind; label: string; testID: string }[];

const WHO_OPTIONS = [
  { value: 'adult', label: 'Adult', testID: 'quick-who-adult' },
  { value: 'child', label: 'Child', testID: 'quick-who-child' },
  { value: 'vehicle', label: 'Vehicle', testID: 'quick-who-vehicle' },
] as const satisfies readonly { value: WhoKind; label: string; testID: string }[];

/** Label and what to measure, per spot where the words differ. */
function fieldWords(spot: SpotKind): Record<QuickField, { label: string; hint: string }> {
  const opening = spot === 'corner' ? 'Crossing aisle width' : spot === 'aisle' ? 'Aisle width' : 'Door width';
  const depth =
    spot === 'doorway' ? 'Depth to see beyond the door' : spot === 'aisle' ? 'Aisle length to see' : 'Length to see round the corner';
  return {
    passageWidthM: { label: 'Your passage width', hint: 'Wall to far side, where the viewer travels.' },
    openingWidthM: { label: opening, hint: 'Across the opening you cannot see into.' },
    depthM: { label: depth, hint: 'From the passage into the hidden area.' },
    viewerBackM: { label: 'Viewer before the opening', hint: 'Where the viewer stands or the driver sits.' },
    eyeHeightM: { label: 'Eye height', hint: 'Standing about 1.6 m; a forklift or truck driver higher.' },
    mirrorAlongM: { label: 'Mirror along the far side', hint: 'From the opening’s near edge; 0 is straight across it.' },
    mirrorHeightM: { label: 'Mirror height', hint: 'To the mirror’s centre.' },
  };
}

const ORDER: QuickField[] = ['passageWidthM', 'openingWidthM', 'depthM', 'viewerBackM', 'eyeHeightM', 'mirrorAlongM', 'mirrorHeightM'];

export interface QuickQuestionFormProps {
  draft: QuickDraft;
  units: UnitSystem;
  errors: Partial<Record<QuickField, string>>;
  onChange: (next: QuickDraft) => void;
}

export function QuickQuestionForm({ draft, units, errors, onChange }: QuickQuestionFormProps) {
  const words = fieldWords(draft.spot);
  return (
    <View style={styles.form}>
      <Segmented
        label="Kind of blind spot"
        options={SPOT_OPTIONS}
        value={draft.spot}
        onChange={(spot) => onChange({ ...draft, spot })}
        stretch
      />
      <Segmented label="Who must be seen" options={WHO_OPTIONS} value={draft.who} onChange={(who) => onChange({ ...draft, who })} stretch />
      <AppText variant="small" tone="muted">
        {units === 'metric'
          ? 'Metres unless you type a unit ("10 ft 6 in" works too).'
          : 'Feet unless you type a unit ("3.2 m" works too).'}
      </AppText>
      {ORDER.map((f) => (
        <NumberField
          key={f}
          name={f}
          label={words[f].label}
          hint={words[f].hint}
          testID={`quick-${f}`}
          units={units}
          kind="distance"
          value={draft[f]}
          min={QUICK_LIMITS[f].min}
          max={QUICK_LIMITS[f].max}
          error={errors[f]}
          onChangeValue={(v) => onChange({ ...draft, [f]: v })}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: spacing.md } });
