// @types/react-dom is not installed; flush-frame.web.ts needs only this one function.
declare module 'react-dom' {
  export function flushSync<R>(fn: () => R): R;
}
