/**
 * react-native-web renders these ARIA props onto the DOM (see its createDOMProps) and reports hover
 * state, but React Native's types omit them. Declaring them keeps field errors tied to their inputs, typed.
 */
import 'react-native';

declare module 'react-native' {
  interface TextInputProps {
    'aria-describedby'?: string;
    'aria-invalid'?: boolean;
    'aria-required'?: boolean;
  }
  interface ViewProps {
    'aria-describedby'?: string;
    'aria-current'?: 'page' | boolean;
    /** Seen before the Pressable inside, which stops Enter from bubbling (components/ui/link-keys.ts). */
    onKeyDownCapture?: (event: WebKeyEvent) => void;
  }
  /** react-native-web adds hover and focus to Pressable's state; on native they are simply absent. */
  interface PressableStateCallbackType {
    readonly hovered?: boolean;
    readonly focused?: boolean;
  }
  interface PressableProps {
    'aria-current'?: 'page' | boolean;
  }
}
