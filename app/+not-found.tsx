import { CenteredMessage, PageTitle, TextLink } from '@/components/ui';

export default function NotFoundScreen() {
  return (
    <>
      <PageTitle title="Not found" />
      <CenteredMessage
        title="There is no page at this address"
        body="The link may be mistyped or from an older version of Sightfan."
        testID="not-found"
        titleTestID="screen-title"
        action={<TextLink href="/" testID="not-found-home" label="Go to your start page" />}
      />
    </>
  );
}
