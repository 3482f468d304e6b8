import { View } from 'react-native';
import { formFrameStyles as styles, type FormFrameProps } from './form-frame-shared';

export type { FormFrameProps } from './form-frame-shared';

/** Native: a plain column; Enter handling lives on each field (onSubmitEditing). See form-frame.web.tsx. */
export function FormFrame({ label, children, testID }: FormFrameProps) {
  return (
    <View style={styles.column} aria-label={label} testID={testID}>
      {children}
    </View>
  );
}
