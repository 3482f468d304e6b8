import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { AppText, Wordmark } from '@/components/ui';
import { navItemsFor, roleLabels, sectionOf } from '@/constants/navigation';
import { layout, palette, spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import type { UserDto } from '@/shared/schemas';
import { ConnectionStatus } from './connection-status';
import { NavLink } from './nav-link';
import { UpdateNotice } from './update-notice';
import { useKeepOnDevice } from './use-keep-on-device';

export interface AppShellProps {
  user: UserDto;
  pathname: string;
  children: ReactNode;
}

/**
 * The signed-in frame. Phone: a slim header with who is signed in, content, and bottom tabs in
 * thumb reach. From 1024 px: a side rail with the same sections, and the person at its foot.
 */
export function AppShell({ user, pathname, children }: AppShellProps) {
  const wide = useIsWide();
  const insets = useSafeAreaInsets();
  const items = navItemsFor(user.role);
  const activeKey = sectionOf(pathname)?.key;
  useKeepOnDevice(user);

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <View
          style={[styles.rail, { paddingTop: insets.top + spacing.xl, paddingBottom: insets.bottom + spacing.lg }]}
          role="navigation"
          aria-label="Sections"
        >
          <View style={styles.railBrand}>
            <Wordmark onDark />
          </View>
          <ConnectionStatus shape="rail" />
          <View style={styles.railItems}>
            {items.map((item) => (
              <NavLink key={item.key} item={item} shape="rail" active={item.key === activeKey} />
            ))}
          </View>
          <View style={styles.railPerson} testID="signed-in-person">
            <AppText variant="label" tone="onAsphalt" numberOfLines={1}>
              {user.name}
            </AppText>
            <AppText variant="small" tone="onAsphaltMuted" numberOfLines={1}>
              {roleLabels[user.role]}
            </AppText>
            <AppText variant="small" tone="onAsphaltMuted" numberOfLines={2}>
              {user.organizationName}
            </AppText>
          </View>
        </View>
        <View style={styles.content}>
          <UpdateNotice />
          {children}
        </View>
      </View>
    );
  }

  return (
    <View style={styles.narrowRoot}>
      <View style={[styles.topBar, { paddingTop: insets.top + spacing.sm }]}>
        <Wordmark onDark />
        <View style={styles.topPerson} testID="signed-in-person">
          <AppText variant="small" tone="onAsphalt" numberOfLines={1}>
            {user.name}
          </AppText>
          <AppText variant="small" tone="onAsphaltMuted" numberOfLines={1}>
            {user.organizationName}
          </AppText>
        </View>
      </View>
      <ConnectionStatus shape="band" />
      <UpdateNotice />
      <View style={styles.content}>{children}</View>
      <View style={[styles.tabs, { paddingBottom: insets.bottom }]} role="navigation" aria-label="Sections">
        {items.map((item) => (
          <NavLink key={item.key} item={item} shape="tab" active={item.key === activeKey} />
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: palette.chalk },
  rail: { width: layout.railWidth, backgroundColor: palette.asphalt, paddingHorizontal: spacing.md, gap: spacing.xl },
  railBrand: { paddingHorizontal: spacing.sm, paddingBottom: spacing.sm },
  railItems: { gap: spacing.xs, flex: 1 },
  railPerson: {
    gap: 2,
    paddingHorizontal: spacing.sm,
    paddingTop: spacing.lg,
    borderTopWidth: 1,
    borderTopColor: palette.asphaltRaised,
  },
  content: { flex: 1, minWidth: 0 },
  narrowRoot: { flex: 1, backgroundColor: palette.chalk },
  topBar: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: spacing.md,
    paddingHorizontal: spacing.lg,
    paddingBottom: spacing.sm,
    backgroundColor: palette.asphalt,
  },
  topPerson: { flexShrink: 1, alignItems: 'flex-end' },
  tabs: { flexDirection: 'row', backgroundColor: palette.asphalt, borderTopWidth: 1, borderTopColor: palette.asphaltRaised },
});
