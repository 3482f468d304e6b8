import { useCallback, useState } from 'react';

interface FocusLikeEvent {
  target?: unknown;
}

function isFocusVisible(event: FocusLikeEvent): boolean {
  const target = event.target as { matches?: (selector: string) => boolean } | undefined;
  // On the web, ask the browser whether this focus came from the keyboard (:focus-visible), so a
  // mouse click or tap does not leave a ring behind; native has no such notion, so show it.
  if (typeof target?.matches !== 'function') return true;
  try {
    return target.matches(':focus-visible');
  } catch {
    return true;
  }
}

/** A keyboard-focus flag for a Pressable, plus the handlers that keep it current. */
export function useFocusVisible() {
  const [focusVisible, setFocusVisible] = useState(false);
  const onFocus = useCallback((event: FocusLikeEvent) => setFocusVisible(isFocusVisible(event)), []);
  const onBlur = useCallback(() => setFocusVisible(false), []);
  return { focusVisible, onFocus, onBlur };
}
