import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from '@/components/forms/form-footer';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { submitWithServerErrors, type FormStatus } from '@/components/forms/server-errors';
import { yupText } from '@/components/forms/yup-rules';
import { AppText, Button, Segmented } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { reviewRules, type CommentPin } from '@/shared/schemas';

export interface CommentValues {
  body: string;
}

export const commentSchema = yup.object({ body: yupText(reviewRules.comment) });

export type PinChoice = 'job' | 'placement' | 'point';

export interface CommentFormProps {
  /** The mirror selected on the plan, if any: a comment can be pinned to it. */
  selectedPlacement: { id: number; label: string } | null;
  /** The point chosen on the plan for the next comment (metres), if any. */
  pickedPointM: [number, number] | null;
  pinChoice: PinChoice;
  onPinChoice: (choice: PinChoice) => void;
  /** True while the plan waits for a tap to choose the point. */
  pickingPoint: boolean;
  onPickPoint: () => void;
  onSubmit: (body: string, pin: CommentPin) => Promise<unknown>;
  /** Test-id prefix, so a reply form and the new-thread form can sit on one screen. */
  idPrefix?: string;
}

/** The pin the form would send now, or null when the chosen kind has nothing to pin to yet. */
export function pinFor(choice: PinChoice, selected: { id: number } | null, pointM: [number, number] | null): CommentPin | null {
  if (choice === 'job') return { kind: 'job' };
  if (choice === 'placement') return selected ? { kind: 'placement', placementId: selected.id } : null;
  return pointM ? { kind: 'point', pointM } : null;
}

const PIN_MISSING: Record<Exclude<PinChoice, 'job'>, string> = {
  placement: 'Select a mirror on the plan first, or pin the comment to the whole job.',
  point: 'Choose the point on the plan first, or pin the comment to the whole job.',
};

/** A new comment thread, pinned to the job, the mirror selected on the plan, or a point tapped on it. */
export function CommentForm(props: CommentFormProps) {
  const { selectedPlacement, pickedPointM, pinChoice, onPinChoice, pickingPoint, onPickPoint, onSubmit } = props;
  const pin = pinFor(pinChoice, selectedPlacement, pickedPointM);
  return (
    <Formik<CommentValues>
      initialValues={{ body: '' }}
      validationSchema={commentSchema}
      onSubmit={async (values, helpers) => {
        if (!pin) return helpers.setStatus({ formError: PIN_MISSING[pinChoice as Exclude<PinChoice, 'job'>] } satisfies FormStatus);
        if (await submitWithServerErrors(helpers, ['body'], values, () => onSubmit(values.body.trim(), pin))) helpers.resetForm();
      }}
    >
      {(form) => (
        <FormFrame label="Add a comment" onSubmit={form.handleSubmit} testID="comment-form">
          <FormikTextField form={form} name="body" label="New comment" testID="comment-body" multiline numberOfLines={3} />
          <View style={styles.pin}>
            <AppText variant="label">Pin it to</AppText>
            <Segmented<PinChoice>
              label="Pin the comment to"
              stretch
              compact
              value={pinChoice}
              onChange={onPinChoice}
              options={[
                { value: 'job', label: 'Whole job', testID: 'comment-pin-job' },
                { value: 'placement', label: 'Mirror', testID: 'comment-pin-placement' },
                { value: 'point', label: 'Point', testID: 'comment-pin-point' },
              ]}
            />
            <AppText variant="small" tone="muted" testID="comment-pin-note">
              {pinChoice === 'placement'
                ? selectedPlacement
                  ? `Pinned to mirror ${selectedPlacement.label}.`
                  : 'Select a mirror on the plan.'
                : pinChoice === 'point'
                  ? pickingPoint
                    ? 'Tap the plan where the comment belongs.'
                    : pickedPointM
                      ? 'Pinned to the point you chose; choose again to move it.'
                      : 'Choose a point, then tap the plan.'
                  : 'Shown in the list, not on the plan.'}
            </AppText>
            {pinChoice === 'point' ? (
              <Button
                label={pickingPoint ? 'Waiting for a tap on the plan…' : 'Choose the point on the plan'}
                testID="comment-pick-point"
                variant="secondary"
                onPress={onPickPoint}
              />
            ) : null}
          </View>
          <FormFooter form={form} testIDPrefix="comment" submitLabel={form.isSubmitting ? 'Posting…' : 'Post comment'} />
        </FormFrame>
      )}
    </Formik>
  );
}

const styles = StyleSheet.create({
  pin: { gap: spacing.xs },
});
