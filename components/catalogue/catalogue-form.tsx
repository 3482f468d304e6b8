import { Formik, type FormikHelpers } from 'formik';
import { StyleSheet, View } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from '@/components/forms/form-footer';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { numberOfText, yupNumber, yupNumberText, yupText } from '@/components/forms/yup-rules';
import { fieldMessage, serverErrorsFor, type FormStatus } from '@/components/forms/server-errors';
import { SHAPE_LABELS, SHAPE_ORDER } from '@/components/placement/mirror-text';
import { NumberField } from '@/components/ui/number-field';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import { ApiError } from '@/shared/api-client';
import type { CatalogueItemDto, CreateCatalogueItemBody, MirrorSpec } from '@/shared/schemas';
import {
  catalogueRules,
  DOME_PORTION_MESSAGE,
  MIRROR_SHAPE_MESSAGE,
  MIRROR_SIZES,
  mirrorSizeProblem,
  numberProblem,
  sizeRule,
  type SizeLimit,
} from '@/shared/schemas/rules';
import { minorToText, parseMoney, type UnitSystem } from '@/shared/units';

type Shape = MirrorSpec['shape'];
type Portion = 'full' | 'half' | 'quarter';

export interface CatalogueFormValues {
  code: string;
  name: string;
  shape: Shape;
  portion: Portion;
  /** SI metres, or null while the field is empty or unreadable. */
  diameterM: number | null;
  widthM: number | null;
  heightM: number | null;
  radiusM: number | null;
  material: string;
  /** Percent as typed, e.g. "80". */
  reflectancePct: string;
  massKg: string;
  price: string;
  currency: string;
  notes: string;
  active: boolean;
}

export const FORM_FIELDS = [
  'code',
  'name',
  'shape',
  'portion',
  'diameterM',
  'widthM',
  'heightM',
  'radiusM',
  'material',
  'reflectancePct',
  'massKg',
  'price',
  'currency',
  'notes',
  'active',
] as const;

export function valuesOf(item: CatalogueItemDto | null): CatalogueFormValues {
  const m = item?.mirror;
  return {
    code: item?.code ?? '',
    name: item?.name ?? '',
    shape: m?.shape ?? 'round',
    portion: m?.shape === 'dome' ? m.portion : 'half',
    diameterM: m && m.shape !== 'rect' ? m.diameterM : null,
    widthM: m?.shape === 'rect' ? m.widthM : null,
    heightM: m?.shape === 'rect' ? m.heightM : null,
    radiusM: m && m.shape !== 'dome' ? m.radiusM : null,
    material: item?.material ?? '',
    reflectancePct: item?.reflectance != null ? String(Math.round(item.reflectance * 1000) / 10) : '',
    massKg: item?.massKg != null ? String(item.massKg) : '',
    price: item ? minorToText(item.unitPriceMinor, item.currency) : '',
    currency: item?.currency ?? 'EUR',
    notes: item?.notes ?? '',
    active: item?.active ?? true,
  };
}

/** Every limit and message comes from shared/schemas/rules.ts (the route's too); sizes are said in the person's units. */
export function catalogueSchema(units: UnitSystem) {
  const opt = yup.number().nullable();
  const size = (limit: SizeLimit) => yupNumber(sizeRule(limit, units));
  return yup.object({
    code: yupText(catalogueRules.code),
    name: yupText(catalogueRules.name),
    shape: yup.string().oneOf(SHAPE_ORDER, MIRROR_SHAPE_MESSAGE).required(MIRROR_SHAPE_MESSAGE),
    portion: yup.string().oneOf(['full', 'half', 'quarter'], DOME_PORTION_MESSAGE).required(DOME_PORTION_MESSAGE),
    diameterM: opt.when('shape', ([shape]: Shape[]) =>
      shape === 'rect' ? opt : size(shape === 'dome' ? MIRROR_SIZES.domeDiameter : MIRROR_SIZES.diameter),
    ),
    widthM: opt.when('shape', { is: 'rect', then: () => size(MIRROR_SIZES.width), otherwise: () => opt }),
    heightM: opt.when('shape', { is: 'rect', then: () => size(MIRROR_SIZES.height), otherwise: () => opt }),
    // A `when` branch replaces the whole field schema, so the cap check lives inside the branch.
    radiusM: opt.when('shape', ([shape]: Shape[]) =>
      shape === 'dome'
        ? opt
        : size(MIRROR_SIZES.radius).test('cap-fits', function check(r) {
            const { widthM: w, heightM: h, diameterM: d } = this.parent as CatalogueFormValues;
            if (r == null) return true;
            const problem =
              shape === 'rect'
                ? w != null && h != null && mirrorSizeProblem({ shape, widthM: w, heightM: h, radiusM: r })
                : d != null && mirrorSizeProblem({ shape: 'round', diameterM: d, radiusM: r });
            return problem ? this.createError({ message: problem.message }) : true;
          }),
    ),
    material: yupText(catalogueRules.material),
    reflectancePct: yupNumberText(catalogueRules.reflectance, 100),
    massKg: yupNumberText(catalogueRules.massKg),
    currency: yupText(catalogueRules.currency),
    price: yup.string().test('price', function check(s) {
      // Formik hands yup an empty field as undefined.
      const r = parseMoney(s ?? '', ((this.parent as Partial<CatalogueFormValues>).currency ?? '').trim().toUpperCase());
      // Reading the text is the form's own job (the request carries a number); the number's limits are the route's.
      const problem = r.ok ? numberProblem(catalogueRules.unitPriceMinor, r.minor) : r.message;
      return problem ? this.createError({ message: problem }) : true;
    }),
    notes: yupText(catalogueRules.notes),
    active: yup.boolean(),
  });
}

/** An empty size is sent as NaN, which the route refuses with the same "Enter the …" sentence. */
export function mirrorOfValues(v: CatalogueFormValues): MirrorSpec {
  const m = (x: number | null) => x ?? Number.NaN;
  if (v.shape === 'rect') return { shape: 'rect', widthM: m(v.widthM), heightM: m(v.heightM), radiusM: m(v.radiusM) };
  if (v.shape === 'dome') return { shape: 'dome', portion: v.portion, diameterM: m(v.diameterM) };
  return { shape: 'round', diameterM: m(v.diameterM), radiusM: m(v.radiusM) };
}

export function bodyOf(v: CatalogueFormValues): CreateCatalogueItemBody {
  const currency = v.currency.trim().toUpperCase();
  const price = parseMoney(v.price, currency);
  return {
    code: v.code.trim(),
    name: v.name.trim(),
    mirror: mirrorOfValues(v),
    material: v.material.trim(),
    reflectance: numberOfText(v.reflectancePct, 100),
    massKg: numberOfText(v.massKg),
    unitPriceMinor: price.ok ? price.minor : Number.NaN,
    currency,
    notes: v.notes,
    active: v.active,
  };
}

/** The server names nested fields ("mirror.radiusM", "unitPriceMinor"); the form names them flat. */
export const SERVER_TO_FORM: Record<string, keyof CatalogueFormValues> = {
  'mirror.diameterM': 'diameterM',
  'mirror.widthM': 'widthM',
  'mirror.heightM': 'heightM',
  'mirror.radiusM': 'radiusM',
  'mirror.portion': 'portion',
  mirror: 'shape',
  unitPriceMinor: 'price',
  reflectance: 'reflectancePct',
};

export function remapServerFields(err: unknown): unknown {
  if (!(err instanceof ApiError)) return err;
  const fields = Object.fromEntries(Object.entries(err.fields).map(([k, m]) => [SERVER_TO_FORM[k] ?? k, m]));
  return new ApiError(err.status, err.message, fields, err.retryAfterS, err.current);
}

export interface CatalogueFormProps {
  item: CatalogueItemDto | null;
  units: UnitSystem;
  submitLabel: string;
  onSubmit: (values: CatalogueFormValues) => Promise<unknown>;
}

export function CatalogueForm({ item, units, submitLabel, onSubmit }: CatalogueFormProps) {
  const submit = async (values: CatalogueFormValues, helpers: FormikHelpers<CatalogueFormValues>) => {
    helpers.setStatus(undefined);
    try {
      await onSubmit(values);
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.current) {
        // Someone saved first: show their values (reload) and say so; the person makes the change again.
        helpers.resetForm({ values: valuesOf(error.current as CatalogueItemDto) });
        helpers.setStatus({
          formError: `${error.message} The form now shows the saved values; make your change again.`,
        } satisfies FormStatus);
        return;
      }
      const { fieldErrors, status } = serverErrorsFor<CatalogueFormValues>(remapServerFields(error), [...FORM_FIELDS], values);
      helpers.setErrors(fieldErrors);
      helpers.setStatus(status);
    }
  };
  return (
    <Formik<CatalogueFormValues>
      initialValues={valuesOf(item)}
      validationSchema={catalogueSchema(units)}
      onSubmit={submit}
      enableReinitialize
    >
      {(form) => {
        const { values, handleSubmit, setFieldValue, setFieldTouched } = form;
        const size = (name: 'diameterM' | 'widthM' | 'heightM' | 'radiusM', label: string, testID: string) => (
          <NumberField
            name={name}
            label={label}
            testID={testID}
            units={units}
            kind="size"
            value={values[name]}
            onChangeValue={(v) => void setFieldValue(name, v)}
            onCommitted={() => void setFieldTouched(name, true)}
            error={fieldMessage(form, name)}
          />
        );
        return (
          <FormFrame label={submitLabel} onSubmit={handleSubmit} testID="catalogue-form">
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField
                  form={form}
                  name="code"
                  label="Code"
                  testID="catalogue-form-code"
                  autoCapitalize="characters"
                  autoCorrect={false}
                />
              </View>
              <View style={styles.flex}>
                <FormikTextField
                  form={form}
                  name="currency"
                  label="Currency"
                  testID="catalogue-form-currency"
                  autoCapitalize="characters"
                  maxLength={3}
                />
              </View>
            </View>
            <FormikTextField form={form} name="name" label="Name" testID="catalogue-form-name" />
            <View style={styles.field}>
              <AppText variant="label">Shape</AppText>
              <Segmented<Shape>
                label="Shape"
                stretch
                value={values.shape}
                onChange={(s) => void setFieldValue('shape', s)}
                options={SHAPE_ORDER.map((s) => ({ value: s, label: SHAPE_LABELS[s], testID: `catalogue-form-shape-${s}` }))}
              />
            </View>
            {values.shape === 'dome' ? (
              <View style={styles.field}>
                <AppText variant="label">Dome portion</AppText>
                <Segmented<Portion>
                  label="Dome portion"
                  stretch
                  value={values.portion}
                  onChange={(p) => void setFieldValue('portion', p)}
                  options={[
                    { value: 'full', label: 'Full', testID: 'catalogue-form-portion-full' },
                    { value: 'half', label: 'Half', testID: 'catalogue-form-portion-half' },
                    { value: 'quarter', label: 'Quarter', testID: 'catalogue-form-portion-quarter' },
                  ]}
                />
              </View>
            ) : null}
            {values.shape === 'rect' ? (
              <View style={styles.pair}>
                <View style={styles.flex}>{size('widthM', 'Width', 'catalogue-form-width')}</View>
                <View style={styles.flex}>{size('heightM', 'Height', 'catalogue-form-height')}</View>
              </View>
            ) : (
              size('diameterM', 'Diameter', 'catalogue-form-diameter')
            )}
            {values.shape !== 'dome' ? (
              size('radiusM', 'Radius of curvature', 'catalogue-form-radius')
            ) : (
              <AppText variant="small" tone="muted">
                A dome is part of a sphere whose radius of curvature is half its diameter.
              </AppText>
            )}
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField
                  form={form}
                  name="price"
                  label={`Unit price (${values.currency.toUpperCase() || 'currency'})`}
                  testID="catalogue-form-price"
                  inputMode="decimal"
                />
              </View>
              <View style={styles.flex}>
                <FormikTextField form={form} name="massKg" label="Mass (kg)" testID="catalogue-form-mass" inputMode="decimal" />
              </View>
            </View>
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField form={form} name="material" label="Material" testID="catalogue-form-material" />
              </View>
              <View style={styles.flex}>
                <FormikTextField
                  form={form}
                  name="reflectancePct"
                  label="Reflectance (%)"
                  testID="catalogue-form-reflectance"
                  inputMode="decimal"
                />
              </View>
            </View>
            <FormikTextField form={form} name="notes" label="Notes" testID="catalogue-form-notes" multiline numberOfLines={3} />
            <View style={styles.field}>
              <AppText variant="label">Offered to installers</AppText>
              <Segmented<'yes' | 'no'>
                label="Offered to installers"
                value={values.active ? 'yes' : 'no'}
                onChange={(a) => void setFieldValue('active', a === 'yes')}
                options={[
                  { value: 'yes', label: 'Offered', testID: 'catalogue-form-active-yes' },
                  { value: 'no', label: 'Withdrawn', testID: 'catalogue-form-active-no' },
                ]}
              />
            </View>
            <FormFooter form={form} testIDPrefix="catalogue-form" submitLabel={submitLabel} />
          </FormFrame>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  field: { gap: spacing.xs },
  pair: { flexDirection: 'row', gap: spacing.md },
  flex: { flex: 1 },
});
