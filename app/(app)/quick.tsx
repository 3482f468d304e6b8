import { QuickSizing } from '@/components/quick/quick-sizing';
import { Screen } from '@/components/ui';

/** Quick sizing: which mirror, how high, pointed where — without drawing a plan first. */
export default function QuickScreen() {
  return (
    <Screen
      title="Quick sizing"
      lead="Which mirror, how high, pointed where: measure the spot, read the answer."
      scrollLabel="Quick sizing"
    >
      <QuickSizing />
    </Screen>
  );
}
