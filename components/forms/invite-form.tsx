import { Formik } from 'formik';
import { useRef } from 'react';
import { StyleSheet, View, type TextInput } from 'react-native';
import * as yup from 'yup';
import { Segmented, AppText } from '@/components/ui';
import { roleOptions, shortRoleLabels } from '@/constants/navigation';
import { spacing } from '@/constants/theme';
import type { Role } from '@/shared/schemas';
import { emailRule, personNameRule, ROLE_MESSAGE } from '@/shared/schemas/rules';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { EmailField } from './credential-fields';
import { FormikTextField } from './formik-text-field';
import { fieldMessage, submitWithServerErrors, type FormStatus } from './server-errors';
import { yupText } from './yup-rules';

export interface InviteValues {
  email: string;
  name: string;
  /** '' until chosen, so nobody is made an admin by default. */
  role: Role | '';
}

export const inviteSchema = yup.object({
  email: yupText(emailRule),
  name: yupText(personNameRule),
  role: yup.string().oneOf(roleOptions, ROLE_MESSAGE).required(ROLE_MESSAGE),
});

/** What the form sends (the route trims and lower-cases again). */
export function inviteBodyOf<R extends Role | ''>(values: InviteValues, role: R) {
  return { email: values.email.trim(), name: values.name.trim(), role };
}

export interface InviteFormProps {
  onSubmit: (values: { email: string; name: string; role: Role }) => Promise<unknown>;
  /** Said after a successful invite, e.g. where the e-mail can be read in demo mode. */
  sentNote?: string;
}

const roleChoices = roleOptions.map((role) => ({ value: role, label: shortRoleLabels[role], testID: `invite-role-${role}` }));

export function InviteForm({ onSubmit, sentNote }: InviteFormProps) {
  const nameRef = useRef<TextInput>(null);
  return (
    <Formik<InviteValues>
      initialValues={{ email: '', name: '', role: '' }}
      validationSchema={inviteSchema}
      onSubmit={async (values, helpers) => {
        if (values.role === '') return; // the schema has already refused this
        const body = inviteBodyOf(values, values.role);
        if (await submitWithServerErrors(helpers, ['email', 'name', 'role'], values, () => onSubmit(body))) {
          helpers.resetForm();
          helpers.setStatus({
            done: `Invitation for ${body.name} <${body.email}> is queued and goes out at once when the mail server answers.${sentNote ? ` ${sentNote}` : ''}`,
          } satisfies FormStatus);
        }
      }}
    >
      {(form) => {
        const { values, handleSubmit, setFieldValue, setFieldTouched } = form;
        const roleError = fieldMessage(form, 'role');
        return (
          <FormFrame label="Invite someone" onSubmit={handleSubmit} testID="invite-form">
            <EmailField
              form={form}
              name="email"
              label="Their e-mail"
              someoneElses
              testID="invite-email"
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => nameRef.current?.focus()}
            />
            <FormikTextField
              form={form}
              inputRef={nameRef}
              name="name"
              label="Their name"
              testID="invite-name"
              autoComplete="off"
              autoCapitalize="words"
              enterKeyHint="send"
              onSubmitEditing={() => handleSubmit()}
            />
            <View style={styles.roleField}>
              <AppText variant="label">Role</AppText>
              <AppText variant="small" tone="muted">
                Installers measure and size mirrors; reviewers approve jobs; admins manage people.
              </AppText>
              <Segmented<Role>
                stretch
                label="Role"
                options={roleChoices}
                value={values.role === '' ? undefined : values.role}
                onChange={(role) => {
                  void setFieldValue('role', role);
                  void setFieldTouched('role', true, false);
                }}
              />
              {roleError ? (
                <AppText variant="small" tone="stop" testID="field-error-role" aria-live="polite">
                  {roleError}
                </AppText>
              ) : null}
            </View>
            <FormFooter form={form} testIDPrefix="invite" submitLabel="Send invitation" doneTestID="invite-sent" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  roleField: { gap: spacing.xs },
});
