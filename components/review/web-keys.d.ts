/**
 * react-native-web passes keyboard events from a View to its DOM element (forwardedProps), which
 * React Native's types omit; the queue's arrow keys need them, typed.
 */
import 'react-native';

declare module 'react-native' {
  interface WebKeyEvent {
    key: string;
    ctrlKey?: boolean;
    metaKey?: boolean;
    altKey?: boolean;
    shiftKey?: boolean;
    preventDefault: () => void;
  }
  interface ViewProps {
    onKeyDown?: (event: WebKeyEvent) => void;
    'aria-sort'?: 'ascending' | 'descending' | 'none';
  }
}
