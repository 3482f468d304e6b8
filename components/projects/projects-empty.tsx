import { StyleSheet, View } from 'react-native';
import Svg, { Path, Rect } from 'react-native-svg';
import { AppText, Card, EmptyState, TextLink } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import type { Role } from '@/shared/schemas';

/** Shown when there are no projects at all: says plainly what will live here; shows no made-up jobs. */
export function ProjectsEmpty({ role }: { role: Role }) {
  return (
    <View style={styles.column}>
      <EmptyState
        testID="projects-empty"
        art={<PlanArt />}
        title="No projects yet"
        body={
          role === 'installer'
            ? 'Each job you take on will be listed here: a site plan or a vehicle outline, the mirrors you mount on it, and where it stands in review. Start one with “New project”.'
            : "Your organisation's installers have no jobs yet. Each site or vehicle they fit with mirrors will be listed here, to read and review."
        }
        next={<TextLink href="/account" testID="projects-go-account" label="Meanwhile, set metric or imperial units on your account" />}
      />
      <Card title="What a project will hold">
        <Bullet text="The place: a site plan with walls, racking and the zones that must be seen, or a vehicle with its driver's eye point." />
        <Bullet text="Each mirror mount: which mirror, how high, where it points, and the fan of what it shows." />
        <Bullet text="A specification sheet (PDF) a safety officer approves and a buyer attaches to a purchase request." />
        <AppText variant="small" tone="muted">
          Only installers create projects; reviewers and administrators read them.
        </AppText>
      </Card>
    </View>
  );
}

function Bullet({ text }: { text: string }) {
  return (
    <View style={styles.bullet}>
      <View style={styles.dot} />
      <AppText style={styles.bulletText}>{text}</AppText>
    </View>
  );
}

function PlanArt() {
  return (
    <Svg width={96} height={72} viewBox="0 0 96 72" aria-hidden>
      <Rect x={4} y={4} width={88} height={64} rx={4} stroke={palette.rule} strokeWidth={3} fill={palette.card} strokeDasharray="6 5" />
      <Path d="M12 12 L84 30 A76 76 0 0 1 50 62 Z" fill={palette.beacon} fillOpacity={0.55} />
      <Path d="M6 8 Q16 12 10 18" stroke={palette.glass} strokeWidth={4} fill="none" strokeLinecap="round" />
    </Svg>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.xl },
  bullet: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start' },
  dot: {
    width: 8,
    height: 8,
    borderRadius: 4,
    backgroundColor: palette.beacon,
    borderWidth: 1,
    borderColor: palette.asphalt,
    marginTop: 9,
  },
  bulletText: { flex: 1 },
});
