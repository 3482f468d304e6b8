/**
 * The project's two criteria: the angle a person's height must span at the eye, through the
 * mirror, to be detected and to be recognised. Typed in minutes of arc, stored in radians in the
 * scene; the sentences come from the shared schema, so the form and the server say the same.
 */
import { Formik, type FormikErrors } from 'formik';
import { StyleSheet, View } from 'react-native';
import { AppText, Button } from '@/components/ui';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { spacing } from '@/constants/theme';
import { ARCMIN_RAD } from '@/shared/optics';
import { criteriaSentence, formatArcmin, isDefaultCriteria } from '@/shared/project-optics';
import { DEFAULT_CRITERIA_RAD, criteriaSettings, type CriteriaSettings } from '@/shared/schemas';

interface Values {
  detect: string;
  recognise: string;
}

const asText = (rad: number) => formatArcmin(rad).replace('′', '');

/** "6", "6′", "6'", "6 arcmin", "7,5" → minutes of arc; null when it is not a number. */
export function parseArcmin(text: string): number | null {
  const s = text
    .trim()
    .replace(/(\d),(\d)/, '$1.$2')
    .replace(/\s*(′|'|arc ?min(utes?)?|min)$/i, '');
  if (!/^\d+(\.\d+)?$/.test(s)) return null;
  return Number(s);
}

/** The typed values as radians, or a sentence per field (the schema's, for values that are numbers). */
export function criteriaFromText(values: Values): { ok: true; criteria: CriteriaSettings } | { ok: false; errors: FormikErrors<Values> } {
  const errors: FormikErrors<Values> = {};
  const detect = parseArcmin(values.detect);
  const recognise = parseArcmin(values.recognise);
  if (detect === null) errors.detect = 'Enter the detect angle in minutes of arc, like "6".';
  if (recognise === null) errors.recognise = 'Enter the recognise angle in minutes of arc, like "20".';
  if (detect === null || recognise === null) return { ok: false, errors };
  const parsed = criteriaSettings.safeParse({ detectRad: detect * ARCMIN_RAD, recogniseRad: recognise * ARCMIN_RAD });
  if (parsed.success) return { ok: true, criteria: parsed.data };
  for (const issue of parsed.error.issues) {
    const field = issue.path[0] === 'detectRad' ? 'detect' : 'recognise';
    errors[field] ??= issue.message;
  }
  return { ok: false, errors };
}

export interface CriteriaSettingsProps {
  criteria: CriteriaSettings;
  canEdit: boolean;
  /** Saves the project's angles; undefined goes back to the defaults. */
  onSave: (criteria: CriteriaSettings | undefined) => void;
}

export function CriteriaSettingsForm({ criteria, canEdit, onSave }: CriteriaSettingsProps) {
  const initial: Values = { detect: asText(criteria.detectRad), recognise: asText(criteria.recogniseRad) };
  return (
    <View style={styles.column} testID="criteria-settings">
      <AppText variant="small" testID="criteria-sentence">
        {criteriaSentence(criteria)}
      </AppText>
      {canEdit ? (
        <Formik<Values>
          initialValues={initial}
          enableReinitialize
          validate={(v) => {
            const r = criteriaFromText(v);
            return r.ok ? {} : r.errors;
          }}
          onSubmit={(v) => {
            const r = criteriaFromText(v);
            if (r.ok) onSave(r.criteria);
          }}
        >
          {(form) => (
            <View style={styles.column}>
              <View style={styles.row}>
                <View style={styles.field}>
                  <FormikTextField
                    form={form}
                    name="detect"
                    label="Detect, minutes of arc"
                    testID="criteria-detect"
                    keyboardType="decimal-pad"
                  />
                </View>
                <View style={styles.field}>
                  <FormikTextField
                    form={form}
                    name="recognise"
                    label="Recognise, minutes of arc"
                    testID="criteria-recognise"
                    keyboardType="decimal-pad"
                  />
                </View>
              </View>
              <View style={styles.row}>
                <Button label="Save angles" variant="secondary" testID="criteria-save" onPress={() => form.handleSubmit()} />
                {!isDefaultCriteria(criteria) ? (
                  <Button
                    label={`Back to ${formatArcmin(DEFAULT_CRITERIA_RAD.detectRad)} and ${formatArcmin(DEFAULT_CRITERIA_RAD.recogniseRad)}`}
                    variant="quiet"
                    testID="criteria-defaults"
                    onPress={() => onSave(undefined)}
                  />
                ) : null}
              </View>
            </View>
          )}
        </Formik>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-start' },
  field: { flexGrow: 1, flexBasis: 140 },
});
