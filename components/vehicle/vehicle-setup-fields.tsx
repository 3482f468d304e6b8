/**
 * The vehicle's part of the new-project form: the kind (which fills a preset), the driver's side,
 * the rule set, and the preset's figures for the installer to check with a tape measure.
 */
import type { FormikProps } from 'formik';
import { StyleSheet, View } from 'react-native';
import { fieldMessage } from '@/components/forms/server-errors';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { NumberField } from '@/components/ui/number-field';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import { vehicleKinds, type VehicleKind } from '@/shared/schemas/vehicle';
import type { UnitSystem } from '@/shared/units';
import { RULE_SETS, type RuleSetId } from '@/shared/vehicle';
import { followDimensions, presetValues, type EyeMethod, type EyeRule, type VehicleSetupValues } from './vehicle-setup';
import { KIND_LABELS, RULE_SET_ORDER, RULE_SET_SHORT } from './vehicle-words';

type DimName = 'lengthM' | 'widthM' | 'cabWidthM' | 'cabFrontBehindM';
type NumName = DimName | 'eyeBehindFrontM' | 'eyeFromCentreM' | 'eyeHeightM';

export function VehicleSetupFields<V extends VehicleSetupValues>({ form, units }: { form: FormikProps<V>; units: UnitSystem }) {
  const { values } = form;
  const setValues = (patch: Partial<VehicleSetupValues>) => void form.setValues({ ...values, ...patch }, true);

  const chooseKind = (kind: VehicleKind) => setValues(presetValues(kind, values.driverSide));

  const setNumber = (name: NumName, v: number | null) => {
    if (name === 'lengthM' || name === 'widthM' || name === 'cabWidthM' || name === 'cabFrontBehindM') {
      const prev = { lengthM: values.lengthM, widthM: values.widthM, cabWidthM: values.cabWidthM, cabFrontBehindM: values.cabFrontBehindM };
      const next = { ...prev, [name]: v };
      setValues({ [name]: v, bodyBoxes: followDimensions(values.bodyBoxes, prev, next) });
    } else setValues({ [name]: v });
  };

  const num = (name: NumName, label: string, hint?: string) => (
    <NumberField
      name={name}
      label={label}
      testID={`vehicle-${name}`}
      units={units}
      kind="distance"
      precision={units === 'metric' ? 2 : undefined}
      value={values[name]}
      onChangeValue={(v) => setNumber(name, v)}
      onCommitted={() => void form.setFieldTouched(name, true)}
      error={fieldMessage(form, name)}
      hint={hint}
    />
  );

  const seat = values.eyeMethod === 'seat';
  return (
    <View style={styles.group} testID="vehicle-setup">
      <View style={styles.field}>
        <AppText variant="label">Kind of vehicle</AppText>
        <AppText variant="small" tone="muted">
          Choosing a kind fills in typical figures; check each one with a tape measure.
        </AppText>
        <ChoiceChips<VehicleKind>
          label="Kind of vehicle"
          value={values.vehicleKind}
          onChange={chooseKind}
          options={vehicleKinds.map((k) => ({ value: k, label: KIND_LABELS[k], testID: `vehicle-kind-${k}` }))}
        />
      </View>
      <View style={styles.field}>
        <AppText variant="label">Driver sits on the</AppText>
        <Segmented<'left' | 'right'>
          label="Driver sits on the"
          stretch
          value={values.driverSide}
          onChange={(driverSide) => setValues({ driverSide })}
          options={[
            { value: 'left', label: 'Left (LHD)', testID: 'vehicle-driver-left' },
            { value: 'right', label: 'Right (RHD)', testID: 'vehicle-driver-right' },
          ]}
        />
      </View>
      <View style={styles.field}>
        <AppText variant="label">Rule the mirrors are checked against</AppText>
        <ChoiceChips<RuleSetId>
          label="Rule the mirrors are checked against"
          value={values.ruleSet}
          onChange={(ruleSet) => setValues({ ruleSet })}
          options={RULE_SET_ORDER.map((r) => ({ value: r, label: RULE_SET_SHORT[r], testID: `vehicle-rule-${r}` }))}
        />
        <AppText variant="small" tone="muted" testID="vehicle-rule-description">
          {`${RULE_SETS[values.ruleSet].title}: ${RULE_SETS[values.ruleSet].description}`}
        </AppText>
      </View>
      <AppText variant="caps">Body, measured from the front bumper</AppText>
      {num('lengthM', 'Overall length')}
      {num('widthM', 'Overall width without mirrors')}
      {num('cabWidthM', 'Cab width')}
      {num('cabFrontBehindM', 'Cab front behind the bumper')}
      <AppText variant="caps">Driver’s eye</AppText>
      <Segmented<EyeMethod>
        label="How the eye is found"
        stretch
        value={values.eyeMethod}
        onChange={(eyeMethod) => setValues({ eyeMethod })}
        options={[
          { value: 'seat', label: 'From the seat point', testID: 'vehicle-eye-seat' },
          { value: 'direct', label: 'Eye measured', testID: 'vehicle-eye-direct' },
        ]}
      />
      {seat ? (
        <Segmented<EyeRule>
          label="Eye above the seat point by"
          stretch
          value={values.eyeRule}
          onChange={(eyeRule) => setValues({ eyeRule })}
          options={[
            { value: 'un-r46', label: 'UN R46 (635 mm up)', testID: 'vehicle-eye-rule-un-r46' },
            { value: 'iso-5006', label: 'ISO 5006 (680 mm up)', testID: 'vehicle-eye-rule-iso-5006' },
          ]}
        />
      ) : null}
      {num('eyeBehindFrontM', seat ? 'Seat point behind the front' : 'Eye behind the front')}
      {num('eyeFromCentreM', seat ? 'Seat point from the centreline' : 'Eye from the centreline')}
      {num('eyeHeightM', seat ? 'Seat point above the ground' : 'Eye above the ground')}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: spacing.md },
  field: { gap: spacing.xs },
});
