import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { focusRing, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { aimOnWall, type QuickOption, type QuickQuestion } from '@/shared/quick';
import { formatAngle, formatLength, formatMoney, formatPercent, type UnitSystem } from '@/shared/units';
import { QuickSketch } from './quick-sketch-view';

/** "Turn 45° from square toward the viewer, tilt 25° down": the aim as it is set on the wall. */
export function aimText(o: Pick<QuickOption, 'azimuthRad' | 'tiltDownRad'>): string {
  const a = aimOnWall(o.azimuthRad);
  const turn = a.toward === 'square' ? 'Square to the wall' : `Turn ${formatAngle(a.turnRad)} from square toward the ${a.toward}`;
  return `${turn}, tilt ${formatAngle(o.tiltDownRad)} down`;
}

export interface QuickOptionCardProps {
  rank: number;
  option: QuickOption;
  question: QuickQuestion;
  units: UnitSystem;
  selected: boolean;
  onPress: () => void;
}

export function QuickOptionCard({ rank, option, question, units, selected, onPress }: QuickOptionCardProps) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const share = formatPercent(option.fraction);
  return (
    <Pressable
      testID={`quick-option-${rank}`}
      role="button"
      aria-pressed={selected}
      aria-label={`${rank}. ${option.item.name}: sees ${share} of the area. Show its numbers.`}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={[styles.card, selected && styles.selected, focusVisible && focusRing]}
    >
      <QuickSketch
        question={question}
        fan={option.region}
        mirrorM={option.positionM}
        width={120}
        maxHeight={120}
        label={`Plan sketch: the fan of ${option.item.name} over the area`}
        testID={`quick-option-${rank}-sketch`}
      />
      <View style={styles.text}>
        <AppText variant="label">
          {rank}. {option.item.name}
        </AppText>
        <AppText variant="heading" testID={`quick-option-${rank}-share`}>
          Sees {share}
        </AppText>
        <AppText variant="small">
          Recognised to {formatLength(option.rangeM, units)} · {formatMoney(option.item.unitPriceMinor, option.item.currency)}
        </AppText>
        <AppText variant="small" tone="muted" testID={`quick-option-${rank}-aim`}>
          At {formatLength(option.heightM, units)}. {aimText(option)}.
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  card: {
    flexDirection: 'row',
    gap: spacing.md,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.ruleSoft,
    backgroundColor: palette.card,
    alignItems: 'flex-start',
  },
  selected: { borderColor: palette.glass, backgroundColor: palette.glassSoft },
  text: { flex: 1, gap: spacing.xxs },
});
