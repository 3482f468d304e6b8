import { Formik } from 'formik';
import { useRef } from 'react';
import { StyleSheet, View, type TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFrame } from '@/components/forms/form-frame';
import { fieldMessage, serverErrorsFor, type FormStatus } from '@/components/forms/server-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { spacing } from '@/constants/theme';
import type { CreateProjectBody } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';

export type UnitsChoice = 'mine' | UnitSystem;

export interface ProjectFormValues {
  name: string;
  customer: string;
  site: string;
  units: UnitsChoice;
  notes: string;
}

/** Mirrors the server's limits (shared/schemas/projects.ts) so most mistakes are caught before sending. */
export const projectSchema = yup.object({
  name: yup.string().trim().required('Give the project a name.').max(80, "Keep the project's name to 80 characters."),
  customer: yup.string().trim().max(160, 'Keep the customer to 160 characters.'),
  site: yup.string().trim().max(200, 'Keep the site to 200 characters.'),
  units: yup.string().oneOf(['mine', 'metric', 'imperial']).required(),
  notes: yup.string().max(5000, 'Keep the notes to 5,000 characters.'),
});

export function toCreateBody(v: ProjectFormValues): CreateProjectBody {
  return { name: v.name.trim(), customer: v.customer.trim(), site: v.site.trim(), units: v.units === 'mine' ? null : v.units, notes: v.notes };
}

export interface ProjectFormProps {
  /** Resolves with the new project's id; rejects with the server's error. */
  onSubmit: (body: CreateProjectBody) => Promise<unknown>;
  myUnits: UnitSystem;
}

const FIELDS = ['name', 'customer', 'site', 'units', 'notes'] as const;

export function ProjectForm({ onSubmit, myUnits }: ProjectFormProps) {
  const customerRef = useRef<TextInput>(null);
  const siteRef = useRef<TextInput>(null);
  return (
    <Formik<ProjectFormValues>
      initialValues={{ name: '', customer: '', site: '', units: 'mine', notes: '' }}
      validationSchema={projectSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSubmit(toCreateBody(values));
        } catch (error) {
          const { fieldErrors, status } = serverErrorsFor<ProjectFormValues>(error, [...FIELDS], values);
          helpers.setErrors(fieldErrors);
          helpers.setStatus(status);
        }
      }}
    >
      {(form) => {
        const { values, status, isSubmitting, handleChange, handleBlur, handleSubmit, setFieldValue } = form;
        const formStatus = status as FormStatus | undefined;
        return (
          <FormFrame label="New project" onSubmit={handleSubmit} testID="project-form">
            <TextField
              name="name"
              label="Project name"
              testID="project-form-name"
              value={values.name}
              onChangeText={handleChange('name')}
              onBlur={handleBlur('name')}
              error={fieldMessage(form, 'name')}
              placeholder="e.g. Dock 3 cross-aisle"
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => customerRef.current?.focus()}
            />
            <TextField
              ref={customerRef}
              name="customer"
              label="Customer"
              testID="project-form-customer"
              value={values.customer}
              onChangeText={handleChange('customer')}
              onBlur={handleBlur('customer')}
              error={fieldMessage(form, 'customer')}
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => siteRef.current?.focus()}
            />
            <TextField
              ref={siteRef}
              name="site"
              label="Site or vehicle"
              testID="project-form-site"
              value={values.site}
              onChangeText={handleChange('site')}
              onBlur={handleBlur('site')}
              error={fieldMessage(form, 'site')}
              placeholder="Address, building, or the vehicle's fleet number"
              enterKeyHint="done"
            />
            <View style={styles.field}>
              <AppText variant="label">Units for this project</AppText>
              <AppText variant="small" tone="muted">
                {`Following your preference shows ${myUnits} for you and each reader's own choice for them.`}
              </AppText>
              <Segmented<UnitsChoice>
                label="Units for this project"
                stretch
                value={values.units}
                onChange={(u) => void setFieldValue('units', u)}
                options={[
                  { value: 'mine', label: 'My preference', testID: 'project-form-units-mine' },
                  { value: 'metric', label: 'Metric', testID: 'project-form-units-metric' },
                  { value: 'imperial', label: 'Imperial', testID: 'project-form-units-imperial' },
                ]}
              />
            </View>
            <TextField
              name="notes"
              label="Notes"
              testID="project-form-notes"
              value={values.notes}
              onChangeText={handleChange('notes')}
              onBlur={handleBlur('notes')}
              error={fieldMessage(form, 'notes')}
              multiline
              numberOfLines={4}
            />
            {formStatus?.formError ? (
              <Notice tone="stop" testID="project-form-error">
                {formStatus.formError}
              </Notice>
            ) : null}
            <Button label="Create project" testID="project-form-submit" onPress={() => handleSubmit()} busy={isSubmitting} block />
          </FormFrame>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  field: { gap: spacing.xs },
});
