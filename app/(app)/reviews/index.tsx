import { ReviewQueuePanel } from '@/components/review/review-queue-panel';
import { Screen } from '@/components/ui';

export default function ReviewsScreen() {
  return (
    <Screen title="Reviews" lead="Jobs installers have sent for checking, longest waiting first." width="full">
      <ReviewQueuePanel />
    </Screen>
  );
}
