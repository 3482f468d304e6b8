/**
 * Each form and the route it sends to must agree: the same generated values go through the
 * form's yup schema (as Formik runs it) and, turned into the request the form would send, through
 * the route's zod schema. Per field, both must accept, or both refuse with the same sentence.
 */
import * as fc from 'fast-check';
import { validateYupSchema, yupToFormErrors } from 'formik';
import { ValidationError, type AnyObject, type ObjectSchema } from 'yup';
import type { z } from 'zod';
import '@testing-library/jest-dom';
import { fireEvent, render, screen } from '@testing-library/react';
import {
  bodyOf,
  catalogueSchema,
  FORM_FIELDS,
  SERVER_TO_FORM,
  valuesOf,
  type CatalogueFormValues,
} from '@/components/catalogue/catalogue-form';
import { PlacementForm } from '@/components/placement/placement-form';
import { changePasswordSchema, type ChangePasswordValues } from '@/components/forms/change-password-form';
import { forgotPasswordSchema, type ForgotPasswordValues } from '@/components/forms/forgot-password-form';
import { inviteBodyOf, inviteSchema, type InviteValues } from '@/components/forms/invite-form';
import { setPasswordSchema, type SetPasswordValues } from '@/components/forms/set-password-form';
import { signInSchema, type SignInValues } from '@/components/forms/sign-in-form';
import { initialProjectValues, projectSchema, toCreateBody, type ProjectFormValues } from '@/components/projects/project-form';
import { formFieldOf, presetValues, VEHICLE_FIELDS } from '@/components/vehicle/vehicle-setup';
import { vehicleKinds, type DriverSide } from '@/shared/schemas/vehicle';
import { sheetEmailBodyOf, sheetEmailSchema, type SheetEmailValues } from '@/components/sheet/sheet-actions';
import {
  acceptInvitationBody,
  changePasswordBody,
  createCatalogueItemBody,
  createProjectBody,
  fieldErrors,
  forgotPasswordBody,
  inviteBody,
  patchPlacementBody,
  roles,
  sheetEmailBody,
  signInBody,
} from '@/shared/schemas';
import { catalogueRules, emailRule, MIRROR_SIZES, type TextRule } from '@/shared/schemas/rules';
import { minorToText } from '@/shared/units';
import { TEST_CATALOGUE, testPlacement } from './fixtures';

const RUNS = 300;

/** The vehicle part of the project form, held at a preset (the site case leaves it untouched). */
const presetRecord = Object.fromEntries(Object.entries(presetValues('rigid-truck', 'left')).map(([k, v]) => [k, fc.constant(v)])) as {
  [K in keyof ReturnType<typeof presetValues>]: fc.Arbitrary<ReturnType<typeof presetValues>[K]>;
};
const VEHICLE_NUMBERS = ['lengthM', 'widthM', 'cabWidthM', 'cabFrontBehindM', 'eyeBehindFrontM', 'eyeFromCentreM', 'eyeHeightM'] as const;

async function formErrors<V extends object>(schema: ObjectSchema<AnyObject>, values: V): Promise<Record<string, string>> {
  try {
    await validateYupSchema(values, schema);
    return {};
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    return yupToFormErrors<Record<string, string>>(e) as Record<string, string>;
  }
}

function routeErrors(schema: z.ZodType, body: unknown, rename: Record<string, string> = {}): Record<string, string> {
  const r = schema.safeParse(body);
  if (r.success) return {};
  const out: Record<string, string> = {};
  for (const [k, m] of Object.entries(fieldErrors(r.error.issues))) {
    const name = rename[k] ?? k;
    if (!(name in out)) out[name] = m;
  }
  return out;
}

/** Text across a rule's whole range: empty, blank, short, padded, around the length limit, pattern matches. */
function textFor(rule: TextRule): fc.Arbitrary<string> {
  const max = rule.maxLength.value;
  const parts: fc.Arbitrary<string>[] = [
    fc.constantFrom('', ' ', '\t \n'),
    fc.string({ maxLength: 12 }),
    fc.string({ unit: 'grapheme', maxLength: 12 }),
    fc
      .tuple(fc.constantFrom('', ' ', '  '), fc.string({ minLength: Math.max(0, max - 2), maxLength: max + 2 }), fc.constantFrom('', ' '))
      .map(([a, b, c]) => a + b + c),
  ];
  if (rule.minLength) parts.push(fc.string({ minLength: rule.minLength.value - 1, maxLength: rule.minLength.value + 1 }));
  if (rule.pattern) parts.push(fc.stringMatching(rule.pattern.re).map((s) => s.slice(0, max + 3)));
  return fc.oneof(...parts);
}

const emailText = fc.oneof(
  textFor(emailRule),
  fc.emailAddress(),
  fc.emailAddress().map((e) => ` ${e.toUpperCase()} `),
  fc.constantFrom('a@b', 'a@b.c', 'a@b.co', 'a..b@c.com', '.a@b.com', 'a.@b.com', 'a@-b.com', 'a b@c.com', `${'a'.repeat(250)}@b.co`),
);

async function expectSameVerdicts<V extends object>(
  arb: fc.Arbitrary<V>,
  form: (v: V) => Promise<Record<string, string>>,
  route: (v: V) => Record<string, string>,
  fields: readonly string[],
  /** Fields where only the verdict must agree for a value (a text the form reads that the request never carries). */
  verdictOnly: (v: V) => readonly string[] = () => [],
) {
  await fc.assert(
    fc.asyncProperty(arb, async (values) => {
      const fromForm = await form(values);
      const fromRoute = route(values);
      const loose = verdictOnly(values);
      for (const f of fields) {
        if (loose.includes(f)) expect([f, fromForm[f] !== undefined]).toEqual([f, fromRoute[f] !== undefined]);
        else expect([f, fromForm[f]]).toEqual([f, fromRoute[f]]);
      }
      expect(Object.keys(fromRoute).filter((f) => !fields.includes(f))).toEqual([]);
    }),
    { numRuns: RUNS },
  );
}

describe('each form refuses what its route refuses, with the same sentence per field', () => {
  it('sign-in form and POST /auth/sign-in', async () => {
    const arb = fc.record<SignInValues>({ email: emailText, password: fc.oneof(fc.string({ maxLength: 210 }), fc.constantFrom('', ' ')) });
    await expectSameVerdicts(
      arb,
      (v) => formErrors(signInSchema, v),
      (v) => routeErrors(signInBody, { email: v.email.trim(), password: v.password }),
      ['email', 'password'],
    );
  });

  it('forgot-password form and POST /auth/password-reset', async () => {
    await expectSameVerdicts(
      fc.record<ForgotPasswordValues>({ email: emailText }),
      (v) => formErrors(forgotPasswordSchema, v),
      (v) => routeErrors(forgotPasswordBody, { email: v.email.trim() }),
      ['email'],
    );
  });

  it('invite form and POST /users', async () => {
    const arb = fc.record<InviteValues>({
      email: emailText,
      name: textFor({ trim: true, maxLength: { value: 120, message: '' } }),
      role: fc.constantFrom('', ...roles),
    });
    await expectSameVerdicts(
      arb,
      (v) => formErrors(inviteSchema, v),
      (v) => routeErrors(inviteBody, inviteBodyOf(v, v.role)),
      ['email', 'name', 'role'],
    );
  });

  it('set-password form and POST /invitations/accept', async () => {
    const password = fc.oneof(
      fc.string({ maxLength: 80 }),
      fc.string({ minLength: 8, maxLength: 12 }),
      fc.string({ minLength: 198, maxLength: 202 }),
      fc.constantFrom('', ' '.repeat(10)),
    );
    const arb = fc.oneof(
      fc.record<SetPasswordValues>({ password, confirm: password }),
      password.map((p) => ({ password: p, confirm: p })),
    );
    await expectSameVerdicts(
      arb,
      (v) => formErrors(setPasswordSchema, v),
      (v) => routeErrors(acceptInvitationBody, { token: 'x'.repeat(43), ...v }),
      ['password', 'confirm'],
    );
  });

  it('change-password form and POST /auth/password', async () => {
    const password = fc.oneof(
      fc.string({ maxLength: 80 }),
      fc.string({ minLength: 8, maxLength: 12 }),
      fc.string({ minLength: 198, maxLength: 202 }),
      fc.constantFrom('', ' '.repeat(10), 'the same long phrase'),
    );
    const arb = fc.oneof(
      fc.record<ChangePasswordValues>({ currentPassword: password, password, confirm: password }),
      fc.tuple(password, password).map(([currentPassword, p]) => ({ currentPassword, password: p, confirm: p })),
    );
    await expectSameVerdicts(
      arb,
      (v) => formErrors(changePasswordSchema, v),
      (v) => routeErrors(changePasswordBody, v),
      ['currentPassword', 'password', 'confirm'],
    );
  });

  it('new-project form and POST /projects', async () => {
    const arb = fc.record<ProjectFormValues>({
      ...presetRecord,
      kind: fc.constant('site'),
      name: textFor({ trim: true, maxLength: { value: 80, message: '' } }),
      customer: textFor({ trim: true, maxLength: { value: 160, message: '' } }),
      site: textFor({ trim: true, maxLength: { value: 200, message: '' } }),
      units: fc.constantFrom('mine', 'metric', 'imperial'),
      notes: fc.oneof(fc.string({ maxLength: 20 }), fc.string({ minLength: 4998, maxLength: 5002 })),
    });
    await expectSameVerdicts(
      arb,
      (v) => formErrors(projectSchema, v),
      (v) => routeErrors(createProjectBody, toCreateBody(v)),
      ['name', 'customer', 'site', 'units', 'notes'],
    );
  });

  it('new-project form for a vehicle and POST /projects: each measurement refused by both with the same sentence', async () => {
    // Lengths across and past the schema's ranges (0–40 m, negative, empty) on any kind's preset and either drive side.
    const length = fc.oneof(
      fc.constant(null),
      fc.double({ min: -1, max: 45, noNaN: true }),
      fc.constantFrom(0, 0.05, 0.5, 2, 3.5, 3.6, 10, 30, 40, 40.01),
    );
    const arb = fc
      .record({
        kind: fc.constantFrom(...vehicleKinds),
        side: fc.constantFrom<DriverSide>('left', 'right'),
        eyeMethod: fc.constantFrom<'seat' | 'direct'>('seat', 'direct'),
        change: fc.array(fc.tuple(fc.constantFrom(...VEHICLE_NUMBERS), length), { maxLength: 3 }),
      })
      .map(({ kind, side, eyeMethod, change }): ProjectFormValues => {
        const values: ProjectFormValues = {
          ...initialProjectValues(),
          kind: 'vehicle',
          name: 'Truck 7',
          ...presetValues(kind, side),
          eyeMethod,
        };
        for (const [field, value] of change) values[field] = value;
        return values;
      });
    await expectSameVerdicts(
      arb,
      (v) => formErrors(projectSchema, v),
      (v) => {
        const r = createProjectBody.safeParse(toCreateBody(v));
        if (r.success) return {};
        const out: Record<string, string> = {};
        for (const issue of r.error.issues) {
          const [head, sub, ...rest] = issue.path;
          if (head !== 'scene' || sub !== 'vehicle') throw new Error(`unexpected route error at ${issue.path.join('.')}`);
          out[formFieldOf(rest)] ??= issue.message;
        }
        return out;
      },
      VEHICLE_FIELDS,
    );
  });

  it('sheet e-mail form and POST /projects/:id/sheet/email', async () => {
    const arb = fc.record<SheetEmailValues>({
      to: emailText,
      note: fc.oneof(fc.string({ maxLength: 20 }), fc.string({ minLength: 1998, maxLength: 2003 })),
    });
    await expectSameVerdicts(
      arb,
      (v) => formErrors(sheetEmailSchema, v),
      (v) => routeErrors(sheetEmailBody, sheetEmailBodyOf(v), { message: 'note' }),
      ['to', 'note'],
    );
  });

  it('catalogue form (metric) and POST /catalogue', async () => {
    // Every field the form shows except the switch the route does not take on create.
    const CATALOGUE_FIELDS = FORM_FIELDS.filter((f) => f !== 'active');
    const limits = Object.values(MIRROR_SIZES).flatMap((s) => [s.minM, s.maxM]);
    const size = fc.oneof(
      fc.constant(null),
      fc.double({ min: -1, max: 60, noNaN: true }),
      fc.double({ min: 0, max: 3.5, noNaN: true }),
      fc.constantFrom(...limits),
      fc.constantFrom(...limits).map((m) => m * (1 - 1e-9)),
    );
    const decimalText = (max: number) =>
      fc.oneof(
        fc.constantFrom('', ' ', 'abc', '-1', '1e3', '12,5', '0'),
        fc.double({ min: 0, max, noNaN: true }).map((n) => String(Math.round(n * 100) / 100)),
        fc.double({ min: 0, max, noNaN: true }).map((n) => String(Math.round(n * 10) / 10).replace('.', ',')),
      );
    const currency = fc.oneof(fc.constantFrom('EUR', 'usd', ' jpy ', 'GBP', 'EU', 'EURO', '', 'E1R'), fc.string({ maxLength: 4 }));
    const arb = fc
      .record<Omit<CatalogueFormValues, 'price'>>({
        code: textFor(catalogueRules.code),
        name: textFor(catalogueRules.name),
        shape: fc.constantFrom('round', 'rect', 'dome'),
        portion: fc.constantFrom('full', 'half', 'quarter'),
        diameterM: size,
        widthM: size,
        heightM: size,
        radiusM: size,
        material: textFor(catalogueRules.material),
        reflectancePct: decimalText(120),
        massKg: decimalText(250),
        currency,
        notes: fc.oneof(fc.string({ maxLength: 20 }), fc.string({ minLength: 1998, maxLength: 2003 })),
        active: fc.boolean(),
      })
      .chain((v) =>
        fc
          .oneof(
            fc.integer({ min: 0, max: 200_000_000 }).map((minor) => minorToText(minor, v.currency.trim().toUpperCase() || 'EUR')),
            fc.constantFrom('', 'free', '12.345', '1,000,000.00', '-5'),
          )
          .map((price) => ({ ...v, price })),
      );
    await expectSameVerdicts(
      arb,
      (v) => formErrors(catalogueSchema('metric'), v),
      (v) => routeErrors(createCatalogueItemBody, bodyOf(v), SERVER_TO_FORM),
      CATALOGUE_FIELDS,
      // A price the form cannot read is never sent as text: the form explains the reading, the route refuses the missing number.
      (v) => (Number.isNaN(bodyOf(v).unitPriceMinor) ? ['price'] : []),
    );
  });
});

describe('numbers are checked in the form, in the reader’s units, before anything is sent', () => {
  const editMounting = (units: 'metric' | 'imperial') => {
    const onChange = jest.fn();
    render(
      <PlacementForm
        placement={testPlacement({ heightM: 2.5 })}
        viewers={[]}
        catalogue={TEST_CATALOGUE}
        units={units}
        canEdit
        errors={{}}
        onChange={onChange}
        onCommit={jest.fn()}
      />,
    );
    return onChange;
  };

  it('typing "-3 ft" as an imperial mounting height names the limit in inches and sends no change', () => {
    const onChange = editMounting('imperial');
    fireEvent.change(screen.getByTestId('placement-height'), { target: { value: '-3 ft' } });
    // 0.2 m is 7.87 in, which a tape reads as 8 in (1 in = 25.4 mm exactly, common practice).
    expect(screen.getByTestId('field-error-heightM')).toHaveTextContent('Mount the mirror at least 8 in above the floor.');
    expect(onChange).not.toHaveBeenCalled();
  });

  it('an imperial mounting height over the limit names it in feet and inches, and a good one is sent after', () => {
    const onChange = editMounting('imperial');
    const field = screen.getByTestId('placement-height');
    fireEvent.change(field, { target: { value: '120 ft' } });
    // 30 m is 1181.1 in: 98 ft 5 in to the nearest inch (1 ft = 12 in).
    expect(screen.getByTestId('field-error-heightM')).toHaveTextContent('A mounting height over 98 ft 5 in is out of range.');
    expect(onChange).not.toHaveBeenCalled();
    fireEvent.change(field, { target: { value: '9 ft' } });
    expect(screen.queryByTestId('field-error-heightM')).toBeNull();
    // 9 ft = 2.7432 m (1 ft = 0.3048 m exactly).
    expect(onChange).toHaveBeenCalledWith({ heightM: expect.closeTo(2.7432, 9) as number });
  });

  it('a metric mounting height below the limit gets the route’s own sentence', () => {
    const onChange = editMounting('metric');
    fireEvent.change(screen.getByTestId('placement-height'), { target: { value: '-3' } });
    const routeSays = routeErrors(patchPlacementBody, { version: 1, heightM: -3 }).heightM;
    expect(screen.getByTestId('field-error-heightM')).toHaveTextContent(routeSays);
    expect(routeSays).toBe('Mount the mirror at least 0.2 m above the floor.');
    expect(onChange).not.toHaveBeenCalled();
  });

  it('the catalogue form (imperial) refuses a radius under half the diameter before sending, as the route does', async () => {
    const values: CatalogueFormValues = {
      code: 'DEMO-R1',
      name: 'Demo round',
      shape: 'round',
      portion: 'full',
      // A 600 mm mirror on a 250 mm sphere: no cap of a 0.25 m sphere is 0.6 m across (it is at most 0.5 m).
      diameterM: 0.6,
      widthM: null,
      heightM: null,
      radiusM: 0.25,
      material: '',
      reflectancePct: '',
      massKg: '',
      price: '12.00',
      currency: 'EUR',
      notes: '',
      active: true,
    };
    const message = 'The radius of curvature must be more than half the diameter: no sphere that small has a cap this wide.';
    expect((await formErrors(catalogueSchema('imperial'), values)).radiusM).toBe(message);
    expect(routeErrors(createCatalogueItemBody, bodyOf(values), SERVER_TO_FORM).radiusM).toBe(message);
    // Just over half the diameter is a real (deep) cap: the form lets it through.
    expect((await formErrors(catalogueSchema('imperial'), { ...values, radiusM: 0.31 })).radiusM).toBeUndefined();
  });

  it('a rectangular panel whose diagonal exceeds the sphere’s diameter is refused in the form too', async () => {
    const values = {
      ...valuesOf(null),
      code: 'DEMO-P1',
      name: 'Demo panel',
      shape: 'rect' as const,
      // 0.6 m × 0.8 m has a 1.0 m diagonal (the 3-4-5 triangle), so a 0.5 m radius is just too small.
      widthM: 0.6,
      heightM: 0.8,
      radiusM: 0.5,
      price: '1.00',
    };
    expect((await formErrors(catalogueSchema('metric'), values)).radiusM).toMatch(/more than half the panel diagonal/);
  });
});
