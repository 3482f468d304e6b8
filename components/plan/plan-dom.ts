/** The few DOM calls the plan makes on the web, where a View's ref is its element. */
export interface DomLike {
  getBoundingClientRect: () => { left: number; top: number };
  addEventListener: (type: 'wheel', fn: (e: WheelEvent) => void, opts: { passive: boolean }) => void;
  removeEventListener: (type: 'wheel', fn: (e: WheelEvent) => void) => void;
  querySelector: (sel: string) => { setAttribute: (k: string, v: string) => void } | null;
  setAttribute: (k: string, v: string) => void;
}

/** On the web a View's ref is its DOM element; natively it is not. */
export function asDom(node: unknown): DomLike | null {
  return node && typeof (node as Partial<DomLike>).getBoundingClientRect === 'function' ? (node as DomLike) : null;
}
