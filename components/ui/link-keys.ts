import type { WebKeyEvent } from 'react-native';

/**
 * Keys for a list row that is a link (role="link" on a Pressable, no href): react-native-web
 * leaves Enter on a link to the browser, which does nothing for a div, so the row would never
 * open from the keyboard. Put this on the row's list item as `onKeyDownCapture` (the Pressable
 * stops Enter from bubbling): Enter or Space opens it.
 */
export function openOnEnterOrSpace(open: () => void): (e: WebKeyEvent) => void {
  return (e) => {
    if (e.key !== 'Enter' && e.key !== ' ') return;
    e.preventDefault();
    open();
  };
}
