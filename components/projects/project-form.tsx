import { Formik } from 'formik';
import { useRef } from 'react';
import { StyleSheet, View, type TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from '@/components/forms/form-footer';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { submitWithServerErrors } from '@/components/forms/server-errors';
import { yupText } from '@/components/forms/yup-rules';
import { projectRules, UNITS_MESSAGE } from '@/shared/schemas/rules';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import type { CreateProjectBody } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { VehicleSetupFields } from '@/components/vehicle/vehicle-setup-fields';
import {
  presetValues,
  VEHICLE_FIELDS,
  vehicleOfValues,
  vehicleSchemaFields,
  type VehicleSetupValues,
} from '@/components/vehicle/vehicle-setup';

export type UnitsChoice = 'mine' | UnitSystem;

export type ProjectKindChoice = 'site' | 'vehicle';

export interface ProjectFormValues extends VehicleSetupValues {
  kind: ProjectKindChoice;
  name: string;
  customer: string;
  site: string;
  units: UnitsChoice;
  notes: string;
}

const KIND_MESSAGE = 'Choose a site or a vehicle.';

/** The server's rules (shared/schemas/rules.ts), so mistakes are caught before sending, in the same words. */
export const projectSchema = yup.object({
  name: yupText(projectRules.name),
  customer: yupText(projectRules.customer),
  site: yupText(projectRules.site),
  units: yup.string().oneOf(['mine', 'metric', 'imperial'], UNITS_MESSAGE).required(UNITS_MESSAGE),
  notes: yupText(projectRules.notes),
  kind: yup.string().oneOf(['site', 'vehicle'], KIND_MESSAGE).required(KIND_MESSAGE),
  ...vehicleSchemaFields(),
});

export function toCreateBody(v: ProjectFormValues): CreateProjectBody {
  const common = {
    name: v.name.trim(),
    customer: v.customer.trim(),
    site: v.site.trim(),
    units: v.units === 'mine' ? null : v.units,
    notes: v.notes,
  };
  if (v.kind === 'site') return common;
  return { ...common, kind: 'vehicle', scene: { walls: [], zones: [], viewers: [], vehicle: vehicleOfValues(v), ruleSet: v.ruleSet } };
}

export const initialProjectValues = (): ProjectFormValues => ({
  kind: 'site',
  name: '',
  customer: '',
  site: '',
  units: 'mine',
  notes: '',
  ...presetValues('rigid-truck', 'left'),
});

export interface ProjectFormProps {
  /** Resolves with the new project's id; rejects with the server's error. */
  onSubmit: (body: CreateProjectBody) => Promise<unknown>;
  myUnits: UnitSystem;
}

const FIELDS = ['kind', 'name', 'customer', 'site', 'units', 'notes', ...VEHICLE_FIELDS] as const;

export function ProjectForm({ onSubmit, myUnits }: ProjectFormProps) {
  const customerRef = useRef<TextInput>(null);
  const siteRef = useRef<TextInput>(null);
  return (
    <Formik<ProjectFormValues>
      initialValues={initialProjectValues()}
      validationSchema={projectSchema}
      onSubmit={async (values, helpers) => {
        await submitWithServerErrors(helpers, FIELDS, values, () => onSubmit(toCreateBody(values)));
      }}
    >
      {(form) => {
        const { values, handleSubmit, setFieldValue } = form;
        return (
          <FormFrame label="New project" onSubmit={handleSubmit} testID="project-form">
            <View style={styles.field}>
              <AppText variant="label">What the mirrors are for</AppText>
              <Segmented<ProjectKindChoice>
                label="What the mirrors are for"
                stretch
                value={values.kind}
                onChange={(k) => void setFieldValue('kind', k)}
                options={[
                  { value: 'site', label: 'A site or building', testID: 'project-form-kind-site' },
                  { value: 'vehicle', label: 'A vehicle', testID: 'project-form-kind-vehicle' },
                ]}
              />
            </View>
            <FormikTextField
              form={form}
              name="name"
              label="Project name"
              testID="project-form-name"
              placeholder="e.g. Dock 3 cross-aisle"
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => customerRef.current?.focus()}
            />
            <FormikTextField
              form={form}
              inputRef={customerRef}
              name="customer"
              label="Customer"
              testID="project-form-customer"
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => siteRef.current?.focus()}
            />
            <FormikTextField
              form={form}
              inputRef={siteRef}
              name="site"
              label="Site or vehicle"
              testID="project-form-site"
              placeholder="Address, building, or the vehicle's fleet number"
              enterKeyHint="done"
            />
            {values.kind === 'vehicle' ? <VehicleSetupFields form={form} units={values.units === 'mine' ? myUnits : values.units} /> : null}
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
            <FormikTextField form={form} name="notes" label="Notes" testID="project-form-notes" multiline numberOfLines={4} />
            <FormFooter form={form} testIDPrefix="project-form" submitLabel="Create project" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  field: { gap: spacing.xs },
});
