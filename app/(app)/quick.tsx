import { QuickSizing } from '@/components/quick/quick-sizing';

/** Quick sizing: which mirror, how high, pointed where — without drawing a plan first. */
export default function QuickScreen() {
  return <QuickSizing />;
}
