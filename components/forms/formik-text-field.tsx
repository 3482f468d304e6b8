import type { FormikProps } from 'formik';
import type { Ref } from 'react';
import type { TextInput } from 'react-native';
import { TextField, type TextFieldProps } from '@/components/ui/text-field';
import { fieldMessage } from './server-errors';

/** The names of a form's fields that hold text: the only ones a text input can edit. */
export type TextFieldName<Values> = { [K in keyof Values]: Values[K] extends string ? K : never }[keyof Values] & string;

export interface FormikTextFieldProps<Values extends object> extends Omit<
  TextFieldProps,
  'name' | 'value' | 'onChangeText' | 'onBlur' | 'error'
> {
  form: FormikProps<Values>;
  /** The Formik field; also the input's DOM id and `field-error-<name>` test id (see TextField). */
  name: TextFieldName<Values>;
  inputRef?: Ref<TextInput>;
}

/** A TextField bound to one Formik field: its value, change, blur (touched) and message (fieldMessage). */
export function FormikTextField<Values extends object>({ form, name, inputRef, ...textFieldProps }: FormikTextFieldProps<Values>) {
  const value: unknown = form.values[name];
  return (
    <TextField
      ref={inputRef}
      {...textFieldProps}
      name={name}
      value={typeof value === 'string' ? value : ''}
      onChangeText={form.handleChange(name)}
      onBlur={form.handleBlur(name)}
      error={fieldMessage(form, name)}
    />
  );
}
