import { Link, type Href } from 'expo-router';
import { useState } from 'react';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { Pressable, StyleSheet } from 'react-native';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { AppText } from './text';

export interface TextLinkProps {
  href: Href;
  label: string;
  testID: string;
}

/**
 * A link that stands alone (not inside a sentence), given the full touch target. A real <a href>
 * on the web. Hover lives in state and the style is one flat object: Link's asChild Slot refuses
 * style arrays and functions.
 */
export function TextLink({ href, label, testID }: TextLinkProps) {
  const [hovered, setHovered] = useState(false);
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Link href={href} asChild>
      <Pressable
        testID={testID}
        aria-label={label}
        onHoverIn={() => setHovered(true)}
        onHoverOut={() => setHovered(false)}
        onFocus={onFocus}
        onBlur={onBlur}
        style={StyleSheet.flatten([styles.link, hovered && styles.hovered, focusVisible && styles.focused])}
      >
        <AppText variant="bodyStrong" tone="glass" style={styles.text}>
          {label}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: { minHeight: layout.minTarget, justifyContent: 'center', paddingHorizontal: spacing.sm, borderRadius: radii.sm },
  focused: focusRing,
  hovered: { backgroundColor: palette.glassSoft },
  text: { textDecorationLine: 'underline', textAlign: 'center' },
});
