import { Link, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { AppText, Card } from '@/components/ui';
import { palette, spacing, type as typeScale } from '@/constants/theme';
import type { OutboxMessageDto } from '@/shared/schemas';
import { splitLinks } from './link-text';
import { OutboxAttachment } from './outbox-attachment';

const timeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** Where the message stands: the outbox keeps retrying until the mail server takes it. */
export function deliveryText(m: OutboxMessageDto): string {
  if (m.status === 'sent') return 'Sent';
  if (m.status === 'failed') return `Not delivered after ${m.attempts ?? 0} attempts; check the mail settings`;
  if (m.status === 'sending') return 'Sending now';
  return m.attempts ? `Waiting to retry (${m.attempts} attempt${m.attempts === 1 ? '' : 's'} so far)` : 'Queued';
}

export function OutboxMessage({ message }: { message: OutboxMessageDto }) {
  return (
    <Card testID={`outbox-message-${message.id}`}>
      <View style={styles.head}>
        <AppText variant="heading" role="heading" aria-level={2} style={styles.subject}>
          {message.subject}
        </AppText>
        <AppText variant="small" tone="muted">
          {timeFormat.format(new Date(message.receivedAt))}
        </AppText>
      </View>
      <View style={styles.meta}>
        <MetaLine label="To" value={message.to.join(', ')} />
        <MetaLine label="From" value={message.from} />
        {message.status ? <MetaLine label="Delivery" value={deliveryText(message)} /> : null}
      </View>
      <AppText style={styles.body} selectable testID={`outbox-text-${message.id}`}>
        {splitLinks(message.text).map((part, i) =>
          part.kind === 'text' ? (
            part.text
          ) : (
            // Opens in a new tab so the outbox stays open; following an invitation there signs that browser in as the invitee.
            <Link
              key={i}
              href={part.url as Href}
              target="_blank"
              rel="noopener"
              style={styles.link}
              testID={`outbox-link-${message.id}-${i}`}
            >
              {part.url}
            </Link>
          ),
        )}
      </AppText>
      {message.attachments.length > 0 ? (
        <View style={styles.attachments}>
          {message.attachments.map((file, i) => (
            <OutboxAttachment key={`${i}-${file.filename}`} messageId={message.id} index={i} file={file} />
          ))}
        </View>
      ) : null}
    </Card>
  );
}

function MetaLine({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.metaLine}>
      <AppText variant="caps" tone="muted" style={styles.metaLabel}>
        {label}
      </AppText>
      <AppText variant="small" style={styles.metaValue} selectable>
        {value}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'baseline', gap: spacing.sm },
  subject: { flexShrink: 1 },
  meta: { gap: spacing.xxs },
  metaLine: { flexDirection: 'row', gap: spacing.sm, alignItems: 'baseline' },
  metaLabel: { width: 76 },
  metaValue: { flex: 1 },
  body: {
    ...typeScale.body,
    color: palette.asphalt,
    backgroundColor: palette.chalk,
    padding: spacing.md,
    borderRadius: 6,
  },
  link: { color: palette.glass, textDecorationLine: 'underline', fontFamily: typeScale.bodyStrong.fontFamily },
  attachments: { gap: spacing.sm, alignItems: 'flex-start' },
});
