import { ReviewsEmpty } from '@/components/reviews/reviews-empty';
import { Screen } from '@/components/ui';

export default function ReviewsScreen() {
  return (
    <Screen title="Reviews" lead="Jobs installers have sent you to check and approve.">
      <ReviewsEmpty />
    </Screen>
  );
}
