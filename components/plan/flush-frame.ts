/** Natively there is no react-dom; React batches the update and renders it promptly anyway. */
export const flushFrame = (apply: () => void): void => apply();
