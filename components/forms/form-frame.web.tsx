import { View } from 'react-native';
import { formFrameStyles as styles, type FormFrameProps } from './form-frame-shared';

/**
 * Web: a real <form>, because browsers' password managers look for one to offer saved logins and
 * to offer saving a new password. Enter in a field is handled by the field (react-native-web calls
 * onSubmitEditing and prevents the default), so the form's own submit only guards against a reload.
 */
export function FormFrame({ label, onSubmit, children, testID }: FormFrameProps) {
  return (
    <form
      aria-label={label}
      data-testid={testID}
      noValidate
      style={{ display: 'flex', flexDirection: 'column', margin: 0 }}
      onSubmit={(event) => {
        event.preventDefault();
        onSubmit();
      }}
    >
      <View style={styles.column}>{children}</View>
    </form>
  );
}
