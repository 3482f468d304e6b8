import { Formik, type FormikHelpers } from 'formik';
import { StyleSheet, View } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from '@/components/forms/form-footer';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { fieldMessage, serverErrorsFor, type FormStatus } from '@/components/forms/server-errors';
import { SHAPE_LABELS, SHAPE_ORDER } from '@/components/placement/mirror-text';
import { NumberField } from '@/components/ui/number-field';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/constants/theme';
import { ApiError } from '@/shared/api-client';
import type { CatalogueItemDto, CreateCatalogueItemBody, MirrorSpec } from '@/shared/schemas';
import { formatLength, minorToText, parseMoney, type UnitSystem } from '@/shared/units';

type Shape = MirrorSpec['shape'];
type Portion = 'full' | 'half' | 'quarter';

export interface CatalogFormValues {
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

export const FORM_FIELDS = ['code', 'name', 'shape', 'portion', 'diameterM', 'widthM', 'heightM', 'radiusM', 'material', 'reflectancePct', 'massKg', 'price', 'currency', 'notes', 'active'] as const;

export function valuesOf(item: CatalogueItemDto | null): CatalogFormValues {
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

/** Size limits match shared/schemas/catalog.ts; messages are in the person's units. */
function sizeRule(what: string, min: number, max: number, units: UnitSystem) {
  const f = (m: number) => formatLength(m, units, { kind: 'size' });
  return yup
    .number()
    .nullable()
    .required(`Enter the ${what}.`)
    .min(min, `The ${what} must be at least ${f(min)}.`)
    .max(max, `The ${what} must be at most ${f(max)}.`);
}

export function catalogSchema(units: UnitSystem) {
  const opt = yup.number().nullable();
  return yup.object({
    code: yup.string().trim().required('Enter a catalogue code.').max(40, 'Keep the code to 40 characters.').matches(/^[A-Za-z0-9._-]+$/, 'Use letters, digits, dot, dash or underscore in the code.'),
    name: yup.string().trim().required('Enter a name.').max(160, 'Keep the name to 160 characters.'),
    shape: yup.string().oneOf(SHAPE_ORDER).required(),
    portion: yup.string().oneOf(['full', 'half', 'quarter']).required(),
    diameterM: opt.when('shape', { is: 'rect', then: () => opt, otherwise: () => sizeRule('diameter', 0.05, 3, units) }),
    widthM: opt.when('shape', { is: 'rect', then: () => sizeRule('width', 0.05, 3, units), otherwise: () => opt }),
    heightM: opt.when('shape', { is: 'rect', then: () => sizeRule('height', 0.05, 3, units), otherwise: () => opt }),
    radiusM: opt
      .when('shape', { is: 'dome', then: () => opt, otherwise: () => sizeRule('radius of curvature', 0.05, 50, units) })
      .test('cap-fits', 'The radius of curvature must be more than half the mirror’s width across (no smaller sphere has a cap that wide).', function check(r) {
        const v = this.parent as CatalogFormValues;
        if (v.shape === 'dome' || r == null) return true;
        const across = v.shape === 'rect' ? Math.hypot(v.widthM ?? 0, v.heightM ?? 0) : (v.diameterM ?? 0);
        return across < 2 * r;
      }),
    material: yup.string().max(80, 'Keep the material to 80 characters.'),
    reflectancePct: yup.string().test('pct', 'Enter the reflectance as a percentage from 4 to 100.', (s) => !s || (/^\d+([.,]\d+)?$/.test(s.trim()) && Number(s.replace(',', '.')) >= 4 && Number(s.replace(',', '.')) <= 100)),
    massKg: yup.string().test('kg', 'Enter the mass in kilograms, more than 0 and at most 200.', (s) => !s || (/^\d+([.,]\d+)?$/.test(s.trim()) && Number(s.replace(',', '.')) > 0 && Number(s.replace(',', '.')) <= 200)),
    currency: yup.string().trim().required('Enter a currency code.').matches(/^[A-Za-z]{3}$/, 'Use a three-letter currency code, like EUR or USD.'),
    price: yup.string().test('price', function check(s) {
      const r = parseMoney(s ?? '', (this.parent as CatalogFormValues).currency.toUpperCase());
      return r.ok || this.createError({ message: r.message });
    }),
    notes: yup.string().max(2000, 'Keep the notes to 2,000 characters.'),
    active: yup.boolean(),
  });
}

export function mirrorOfValues(v: CatalogFormValues): MirrorSpec {
  if (v.shape === 'rect') return { shape: 'rect', widthM: v.widthM ?? 0, heightM: v.heightM ?? 0, radiusM: v.radiusM ?? 0 };
  if (v.shape === 'dome') return { shape: 'dome', portion: v.portion, diameterM: v.diameterM ?? 0 };
  return { shape: 'round', diameterM: v.diameterM ?? 0, radiusM: v.radiusM ?? 0 };
}

const num = (s: string) => Number(s.trim().replace(',', '.'));

export function bodyOf(v: CatalogFormValues): CreateCatalogueItemBody {
  const currency = v.currency.trim().toUpperCase();
  const price = parseMoney(v.price, currency);
  return {
    code: v.code.trim(),
    name: v.name.trim(),
    mirror: mirrorOfValues(v),
    material: v.material.trim(),
    reflectance: v.reflectancePct.trim() ? num(v.reflectancePct) / 100 : null,
    massKg: v.massKg.trim() ? num(v.massKg) : null,
    unitPriceMinor: price.ok ? price.minor : 0,
    currency,
    notes: v.notes,
    active: v.active,
  };
}

/** The server names nested fields ("mirror.radiusM", "unitPriceMinor"); the form names them flat. */
const SERVER_TO_FORM: Record<string, keyof CatalogFormValues> = {
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

export interface CatalogFormProps {
  item: CatalogueItemDto | null;
  units: UnitSystem;
  submitLabel: string;
  onSubmit: (values: CatalogFormValues) => Promise<unknown>;
}

export function CatalogForm({ item, units, submitLabel, onSubmit }: CatalogFormProps) {
  const submit = async (values: CatalogFormValues, helpers: FormikHelpers<CatalogFormValues>) => {
    helpers.setStatus(undefined);
    try {
      await onSubmit(values);
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.current) {
        // Someone saved first: show their values (reload) and say so; the person makes the change again.
        helpers.resetForm({ values: valuesOf(error.current as CatalogueItemDto) });
        helpers.setStatus({ formError: error.message } satisfies FormStatus);
        return;
      }
      const { fieldErrors, status } = serverErrorsFor<CatalogFormValues>(remapServerFields(error), [...FORM_FIELDS], values);
      helpers.setErrors(fieldErrors);
      helpers.setStatus(status);
    }
  };
  return (
    <Formik<CatalogFormValues> initialValues={valuesOf(item)} validationSchema={catalogSchema(units)} onSubmit={submit} enableReinitialize>
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
          <FormFrame label={submitLabel} onSubmit={handleSubmit} testID="catalog-form">
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField form={form} name="code" label="Code" testID="catalog-form-code" autoCapitalize="characters" autoCorrect={false} />
              </View>
              <View style={styles.flex}>
                <FormikTextField form={form} name="currency" label="Currency" testID="catalog-form-currency" autoCapitalize="characters" maxLength={3} />
              </View>
            </View>
            <FormikTextField form={form} name="name" label="Name" testID="catalog-form-name" />
            <View style={styles.field}>
              <AppText variant="label">Shape</AppText>
              <Segmented<Shape>
                label="Shape"
                stretch
                value={values.shape}
                onChange={(s) => void setFieldValue('shape', s)}
                options={SHAPE_ORDER.map((s) => ({ value: s, label: SHAPE_LABELS[s], testID: `catalog-form-shape-${s}` }))}
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
                    { value: 'full', label: 'Full', testID: 'catalog-form-portion-full' },
                    { value: 'half', label: 'Half', testID: 'catalog-form-portion-half' },
                    { value: 'quarter', label: 'Quarter', testID: 'catalog-form-portion-quarter' },
                  ]}
                />
              </View>
            ) : null}
            {values.shape === 'rect' ? (
              <View style={styles.pair}>
                <View style={styles.flex}>{size('widthM', 'Width', 'catalog-form-width')}</View>
                <View style={styles.flex}>{size('heightM', 'Height', 'catalog-form-height')}</View>
              </View>
            ) : (
              size('diameterM', 'Diameter', 'catalog-form-diameter')
            )}
            {values.shape !== 'dome' ? (
              size('radiusM', 'Radius of curvature', 'catalog-form-radius')
            ) : (
              <AppText variant="small" tone="muted">
                A dome is part of a sphere whose radius of curvature is half its diameter.
              </AppText>
            )}
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField form={form} name="price" label={`Unit price (${values.currency.toUpperCase() || 'currency'})`} testID="catalog-form-price" inputMode="decimal" />
              </View>
              <View style={styles.flex}>
                <FormikTextField form={form} name="massKg" label="Mass (kg)" testID="catalog-form-mass" inputMode="decimal" />
              </View>
            </View>
            <View style={styles.pair}>
              <View style={styles.flex}>
                <FormikTextField form={form} name="material" label="Material" testID="catalog-form-material" />
              </View>
              <View style={styles.flex}>
                <FormikTextField form={form} name="reflectancePct" label="Reflectance (%)" testID="catalog-form-reflectance" inputMode="decimal" />
              </View>
            </View>
            <FormikTextField form={form} name="notes" label="Notes" testID="catalog-form-notes" multiline numberOfLines={3} />
            <View style={styles.field}>
              <AppText variant="label">Offered to installers</AppText>
              <Segmented<'yes' | 'no'>
                label="Offered to installers"
                value={values.active ? 'yes' : 'no'}
                onChange={(a) => void setFieldValue('active', a === 'yes')}
                options={[
                  { value: 'yes', label: 'Offered', testID: 'catalog-form-active-yes' },
                  { value: 'no', label: 'Withdrawn', testID: 'catalog-form-active-no' },
                ]}
              />
            </View>
            <FormFooter status={form.status} errorTestID="catalog-form-error" submitLabel={submitLabel} submitTestID="catalog-form-submit" busy={form.isSubmitting} onSubmit={() => handleSubmit()} />
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
