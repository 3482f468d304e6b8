/**
 * The site plan's phone drawer (not the PDF sheet), in the shared frame (drawer-frame.tsx). Folded: one strip with the selected item, its key numbers and the
 * short caution, in thumb reach. Peek: the details (editor or summary) scroll in the lower part while the plan
 * above keeps the selected item in view. Full: most of the screen, only when asked for.
 */
import type { ReactNode } from 'react';
import { SHORT_CAUTION } from '@/shared/cautions';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import { adultRangesText } from '@/shared/project-optics';
import type { PlacementDto, Scene } from '@/shared/schemas';
import { formatLength, type UnitSystem } from '@/shared/units';
import { formatCoveredShare } from '@/shared/zone-verdict';
import { DrawerButton, DrawerFrame } from './drawer-frame';
import type { PlanSelection } from './plan-types';

export interface PlanDrawerProps {
  size: DrawerSize;
  onSize: (size: DrawerSize) => void;
  selection: PlanSelection;
  placement: PlacementDto | undefined;
  scene: Scene;
  evaluation: PlanEvaluation | null;
  units: UnitSystem;
  children: ReactNode;
}

/** The collapsed strip's two lines: what is selected, and the numbers a person glances at. */
export function drawerSummary(p: Pick<PlanDrawerProps, 'selection' | 'placement' | 'scene' | 'evaluation' | 'units'>): {
  title: string;
  numbers: string;
} {
  const zones = p.scene.zones
    .map((z) => {
      const ev = p.evaluation?.zones.find((e) => e.zoneId === z.id);
      return `${z.name} ${formatCoveredShare(ev?.fraction ?? Number.NaN)}`;
    })
    .join(' · ');
  if (p.selection?.kind === 'placement' && p.placement) {
    const ev = p.evaluation?.placements.find((e) => e.placementId === p.placement!.id);
    const range = ev?.numbers ? adultRangesText(ev.numbers, (m) => formatLength(m, p.units)) : (ev?.problem?.message ?? '');
    return { title: p.placement.label, numbers: [range, zones].filter(Boolean).join(' · ') };
  }
  if (p.selection?.kind === 'viewer') {
    const v = p.scene.viewers.find((x) => x.id === p.selection!.id);
    if (v) return { title: v.name, numbers: `Eye ${formatLength(v.eyeHeightM, p.units)}` };
  }
  if (p.selection?.kind === 'zone') {
    const z = p.scene.zones.find((x) => x.id === p.selection!.id);
    const ev = p.evaluation?.zones.find((e) => e.zoneId === p.selection!.id);
    if (z) return { title: z.name, numbers: `${formatCoveredShare(ev?.fraction ?? Number.NaN)} covered` };
  }
  return { title: 'Project summary', numbers: zones || 'No zones yet' };
}

/**
 * How much of the screen the drawer takes: folded (the strip only), a peek that leaves the selected
 * item and its fan in view above it, or full height when the person asks for it.
 */
export type DrawerSize = 'folded' | 'peek' | 'full';

/**
 * Fractions of the window's height. The peek leaves a bit more than half the screen to the plan;
 * full height still leaves room for the header and the tab bar (at 0.84 the drawer ran under the
 * tab bar on a 390 × 844 phone and the tabs covered the last caution).
 */
export const DRAWER_HEIGHT_SHARE: Record<Exclude<DrawerSize, 'folded'>, number> = { peek: 0.44, full: 0.66 };

export function PlanDrawer(p: PlanDrawerProps) {
  const { title, numbers } = drawerSummary(p);
  const open = p.size !== 'folded';
  return (
    <DrawerFrame
      openShare={open ? DRAWER_HEIGHT_SHARE[p.size === 'full' ? 'full' : 'peek'] : null}
      title={title}
      numbers={numbers}
      numbersLines={open ? 2 : 1}
      caution={SHORT_CAUTION}
      testIds={PLAN_DRAWER_IDS}
      buttons={
        <>
          {open ? (
            <DrawerButton
              testID="drawer-size"
              label={p.size === 'full' ? 'Smaller' : 'Taller'}
              onPress={() => p.onSize(p.size === 'full' ? 'peek' : 'full')}
            />
          ) : null}
          <DrawerButton
            testID="drawer-toggle"
            label={open ? 'Less' : 'Details'}
            expanded={open}
            onPress={() => p.onSize(open ? 'folded' : 'peek')}
          />
        </>
      }
    >
      {p.children}
    </DrawerFrame>
  );
}

const PLAN_DRAWER_IDS = {
  drawer: 'plan-drawer',
  title: 'drawer-title',
  numbers: 'drawer-numbers',
  caution: 'drawer-caution',
  body: 'plan-drawer-body',
};
