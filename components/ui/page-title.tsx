import Head from 'expo-router/head';

/** The browser tab's title, so tabs and history entries say which screen they are. */
export function PageTitle({ title }: { title: string }) {
  return (
    <Head>
      <title>{`${title} · Sightfan`}</title>
    </Head>
  );
}
