import { flushSync } from 'react-dom';

/**
 * Renders a live drag frame synchronously inside its animation-frame callback, so the recompute and
 * the redraw land before that frame is painted instead of one frame late.
 */
export const flushFrame = (apply: () => void): void => flushSync(apply);
