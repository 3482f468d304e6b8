/**
 * The vehicle's fields as a list: each with its rule, class, status mark and what the mark means,
 * the share its mirrors show, the share the rule asks for, and the verdict; then the test
 * cylinders and the mounting sentences. Every figure comes from the evaluation.
 */
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { palette, radii, spacing } from '@/constants/theme';
import type { VehicleEvaluation } from '@/hooks/use-vehicle-evaluation';
import { formatArcmin, formatFieldShare, vehicleFieldClass } from '@/shared/project-optics';
import { STATUS_MARK_MEANING, type FieldScore, type VehicleField } from '@/shared/vehicle';
import { verdictWord } from './vehicle-words';

const VERDICT_TONE: Record<FieldScore['verdict'], BadgeTone> = { pass: 'go', short: 'stop', 'no-verdict': 'neutral' };

/** "Needs 85 %" or the rule's reason for giving none. */
export function thresholdText(f: VehicleField): string {
  return f.requiredShare === null ? 'No pass mark' : `Needs ${formatFieldShare(f.requiredShare)}`;
}

export function VehicleFieldList({ evaluation }: { evaluation: VehicleEvaluation }) {
  const scores = new Map((evaluation.score?.fields ?? []).map((s) => [s.field.id, s]));
  return (
    <View style={styles.list} testID="vehicle-fields">
      <AppText variant="caps">Ground fields</AppText>
      {evaluation.fields.length === 0 ? (
        <AppText tone="muted">
          This rule set asks no ground field of this kind of vehicle; add test cylinders or own fields instead.
        </AppText>
      ) : null}
      {evaluation.fields.map((f) => {
        const s = scores.get(f.id);
        return (
          <View key={f.id} style={styles.row} testID={`vehicle-field-row-${f.id}`}>
            <View style={styles.head}>
              <View style={styles.title}>
                <AppText variant="label">{f.name}</AppText>
                <AppText variant="small" tone="muted">{`${f.rule} · class ${vehicleFieldClass(f.code)}`}</AppText>
              </View>
              <View style={styles.figure}>
                <AppText variant="heading" testID={`vehicle-field-share-${f.id}`}>
                  {s ? formatFieldShare(s.share) : '—'}
                </AppText>
                {s ? (
                  <Badge label={verdictWord(s.verdict)} tone={VERDICT_TONE[s.verdict]} testID={`vehicle-field-verdict-${f.id}`} />
                ) : null}
              </View>
            </View>
            <AppText variant="small">{`${thresholdText(f)}: ${f.requiredShareBasis}`}</AppText>
            <AppText variant="small" tone="muted">
              {`[${f.status}] ${STATUS_MARK_MEANING[f.status]}. ${f.basis}`}
            </AppText>
            {f.scoredToNote ? (
              <AppText variant="small" tone="muted">
                {f.scoredToNote}
              </AppText>
            ) : null}
          </View>
        );
      })}
      {evaluation.score && evaluation.score.targets.length > 0 ? (
        <>
          <AppText variant="caps">Test cylinders</AppText>
          {evaluation.score.targets.map((t) => (
            <View key={t.targetId} style={styles.row} testID={`vehicle-target-${t.targetId}`}>
              <AppText variant="label">{t.name}</AppText>
              <AppText variant="small">
                {t.visible
                  ? `Seen${t.heightAngleRad !== null ? `, its image ${formatArcmin(t.heightAngleRad)} tall` : ''}${
                      t.insideEdgeRad !== null ? `, ${formatArcmin(t.insideEdgeRad)} inside the mirror's edge` : ''
                    }; ${t.passes ? 'meets' : 'misses'} its image rule.`
                  : 'Not seen in any mirror.'}
              </AppText>
            </View>
          ))}
        </>
      ) : null}
      {evaluation.score && evaluation.score.mounting.length > 0 ? (
        <>
          <AppText variant="caps">Mounting</AppText>
          {evaluation.score.mounting.map((m, i) => (
            <AppText key={`${m.mirrorId}-${m.check}-${i}`} variant="small" tone="stop" testID={`vehicle-mounting-${m.mirrorId}-${m.check}`}>
              {m.sentence}
            </AppText>
          ))}
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: {
    gap: spacing.xs,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
    backgroundColor: palette.card,
  },
  head: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  title: { flex: 1, minWidth: 0 },
  figure: { alignItems: 'flex-end', gap: spacing.xxs },
});
