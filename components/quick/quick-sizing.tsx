/**
 * Quick sizing: the blind spot as a few measured values, answered live with the catalogue's
 * mirrors ranked by share of the area seen, each with its fan, aim and numbers; one tapped shows
 * its full numbers and side view; "Save as a job" turns it into a project with the mirror placed.
 */
import { router } from 'expo-router';
import { useMemo, useState } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { PlacementLiveNumbers } from '@/components/placement/placement-live-numbers';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { AppText, Button, Card, Notice } from '@/components/ui';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { palette, spacing } from '@/constants/theme';
import { useCatalogueQuery } from '@/hooks/use-catalogue';
import { quickSaveVars, useQuickSaveMutation } from '@/hooks/use-quick-save';
import { evaluateProject, type ProjectEvaluation } from '@/shared/project-optics';
import {
  DEFAULT_QUICK_QUESTION,
  QUICK_IDS,
  quickPlacementBody,
  quickProblems,
  quickScene,
  type QuickOption,
  type QuickQuestion,
} from '@/shared/quick';
import { QuickCautionLine } from './quick-caution-line';
import { QuickOptionCard } from './quick-option-card';
import { QuickQuestionForm, type QuickDraft } from './quick-question-form';
import { useQuickRanking } from './use-quick-ranking';

function questionOf(draft: QuickDraft): QuickQuestion | null {
  if (Object.keys(quickProblems(draft)).length > 0) return null;
  return draft as QuickQuestion;
}

/** The chosen option through the project evaluation (the numbers a saved job will show). */
function evaluationOf(question: QuickQuestion, option: QuickOption): ProjectEvaluation | null {
  const body = quickPlacementBody({
    catalogueItemId: option.item.id,
    positionM: option.positionM,
    heightM: option.heightM,
    azimuthRad: option.azimuthRad,
    tiltDownRad: option.tiltDownRad,
  });
  try {
    return evaluateProject({
      scene: quickScene(question),
      placements: [{ ...body, id: 0, customMirror: null, catalogueItemId: option.item.id, viewerId: QUICK_IDS.viewer }],
      catalogue: [option.item],
    });
  } catch {
    return null;
  }
}

/** The screen's content (the route puts it in its Screen). */
export function QuickSizing() {
  const units = useDisplayUnits();
  const catalogue = useCatalogueQuery();
  const [draft, setDraft] = useState<QuickDraft>(DEFAULT_QUICK_QUESTION);
  const [selected, setSelected] = useState<number | null>(null);
  const problems = quickProblems(draft);
  const question = useMemo(() => questionOf(draft), [draft]);
  const ranking = useQuickRanking(question, catalogue.data);
  const save = useQuickSaveMutation();
  const chosen = selected !== null && question && ranking.answered ? (ranking.options[selected] ?? null) : null;
  const evaluation = useMemo(
    () => (chosen && ranking.answered ? evaluationOf(ranking.answered, chosen) : null),
    [chosen, ranking.answered],
  );

  const change = (next: QuickDraft) => {
    setDraft(next);
    setSelected(null);
  };

  return (
    <>
      <QuickQuestionForm draft={draft} units={units} errors={problems} onChange={change} />
      <View style={styles.answers} testID="quick-answers" aria-busy={ranking.busy} aria-live="polite">
        <View style={styles.answersHead}>
          <AppText variant="heading">Best mirrors for this spot</AppText>
          {ranking.busy || catalogue.isPending ? (
            <View style={styles.busy} testID="quick-busy">
              <ActivityIndicator color={palette.glass} />
              <AppText variant="small" tone="muted">
                Working it out…
              </AppText>
            </View>
          ) : null}
        </View>
        {catalogue.isError ? <Notice tone="stop">The catalogue did not load; check the connection and try again.</Notice> : null}
        {!question ? <AppText tone="muted">Fill in every measurement to see the answer.</AppText> : null}
        {ranking.problem && question ? (
          <AppText tone="stop" testID="quick-problem">
            {ranking.problem}
          </AppText>
        ) : null}
        {ranking.answered && question && ranking.options.length > 0 ? <QuickCautionLine /> : null}
        {ranking.answered && question
          ? ranking.options.map((o, i) => (
              <QuickOptionCard
                key={`${o.item.id}-${o.azimuthRad}-${o.tiltDownRad}`}
                rank={i + 1}
                option={o}
                question={ranking.answered as QuickQuestion}
                units={units}
                selected={selected === i}
                onPress={() => setSelected(selected === i ? null : i)}
              />
            ))
          : null}
      </View>
      {chosen && ranking.answered ? (
        <View style={styles.details} testID="quick-details">
          <Button
            label="Save as a job"
            testID="quick-save"
            busy={save.isPending && !save.isPaused}
            disabled={save.isPaused}
            block
            onPress={() => {
              save.mutate(quickSaveVars(ranking.answered as QuickQuestion, chosen, new Date()), {
                onSuccess: (projectId) => router.push(`/projects/${projectId}`),
              });
            }}
          />
          {save.isPaused ? (
            <Notice tone="info" testID="quick-save-waiting">
              Kept on this device: the job is sent as soon as there is a connection again.
            </Notice>
          ) : null}
          {save.isError ? <Notice tone="stop">{`The job was not saved: ${save.error.message}`}</Notice> : null}
          <PlacementLiveNumbers placementId={0} evaluation={evaluation} scene={quickScene(ranking.answered)} units={units} />
        </View>
      ) : (
        <SafetyCautions compact />
      )}
      {chosen ? null : (
        <Card title="How this is worked out">
          <AppText variant="small">
            Every catalogue mirror is tried at the mirror’s place and height, turned and tilted in steps; the area counts as seen where the
            person or vehicle would look large enough to recognise. Save as a job to fine-tune it on the plan.
          </AppText>
        </Card>
      )}
    </>
  );
}

const styles = StyleSheet.create({
  answers: { gap: spacing.md },
  answersHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: spacing.sm },
  busy: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  details: { gap: spacing.lg },
});
