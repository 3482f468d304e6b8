import { Link } from 'expo-router';
import { useState } from 'react';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { Pressable, StyleSheet, View } from 'react-native';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import type { NavItem } from '@/constants/navigation';
import { AppText, NavIcon } from '@/components/ui';

export interface NavLinkProps {
  item: NavItem;
  active: boolean;
  /** 'rail': icon and label in a row; 'tab': icon over label, sharing the bottom bar. */
  shape: 'rail' | 'tab';
}

/**
 * A real link (an <a href> on the web, so it can be opened in a new tab), test id `nav-<key>`.
 * Hover is tracked in state because Link's asChild takes only a plain style object, not a style function.
 */
export function NavLink({ item, active, shape }: NavLinkProps) {
  const [hovered, setHovered] = useState(false);
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const iconColor = active ? palette.beacon : palette.onAsphaltMuted;
  return (
    <Link href={item.href} asChild>
      <Pressable
        testID={`nav-${item.key}`}
        aria-label={item.label}
        aria-current={active ? 'page' : undefined}
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={onFocus}
        onBlur={onBlur}
        // Link's Slot needs one flat style object (expo-router refuses arrays there).
        style={StyleSheet.flatten([
          shape === 'rail' ? styles.rail : styles.tab,
          hovered && !active && styles.hovered,
          active && shape === 'rail' && styles.railActive,
          focusVisible && styles.focused,
        ])}
      >
        {shape === 'tab' ? <View style={[styles.tabMarker, active && styles.tabMarkerActive]} /> : null}
        <NavIcon name={item.key} color={iconColor} size={shape === 'rail' ? 24 : 26} />
        <AppText variant={shape === 'rail' ? 'label' : 'small'} tone={active ? 'onAsphalt' : 'onAsphaltMuted'} numberOfLines={1}>
          {item.label}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  rail: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    minHeight: layout.minTarget + 4,
    paddingHorizontal: spacing.lg,
    borderRadius: radii.md,
    borderLeftWidth: 4,
    borderLeftColor: 'transparent',
  },
  railActive: { backgroundColor: palette.asphaltRaised, borderLeftColor: palette.beacon },
  focused: { ...focusRing, outlineColor: palette.beacon, outlineOffset: -3 },
  hovered: { backgroundColor: palette.asphaltRaised },
  tab: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: 2, minHeight: 60, paddingBottom: spacing.xs },
  tabMarker: { position: 'absolute', top: 0, height: 4, width: 40, borderBottomLeftRadius: 3, borderBottomRightRadius: 3 },
  tabMarkerActive: { backgroundColor: palette.beacon },
});
