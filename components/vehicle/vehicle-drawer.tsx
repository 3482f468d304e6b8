/**
 * The phone's bottom drawer for a vehicle job, in the plan's frame (drawer-frame.tsx). Folded: the fields' shares and verdicts in one
 * glance, and the planning line with the cautions' gist, so neither is ever out of sight.
 * Unfolded: the details, scrolling, over the lower part of the top view.
 */
import type { ReactNode } from 'react';
import { DrawerButton, DrawerFrame } from '@/components/plan/drawer-frame';
import { SHORT_CAUTION } from '@/shared/cautions';
import type { VehicleEvaluation, VehiclePlacement } from '@/hooks/use-vehicle-evaluation';
import { formatFieldShare, verdictText } from '@/shared/project-optics';
import { fieldLabel } from './vehicle-words';

/**
 * "V passenger 98.5 % pass · IV passenger 5.4 % short · …": the fields the mirrors show most of
 * first, so the ones being worked on stay in the folded strip's lines.
 */
export function fieldsSummary(e: VehicleEvaluation | null): string {
  if (!e) return '';
  if (!e.score) return e.problem ?? '';
  if (e.score.fields.length === 0) return 'No ground fields under this rule set';
  return [...e.score.fields]
    .sort((a, b) => b.share - a.share)
    .map((s) => {
      const side = s.field.side === null ? '' : s.field.side === e.geometry.passengerSide ? ' passenger' : ' driver';
      return `${fieldLabel(s.field.code)}${side} ${formatFieldShare(s.share)} ${verdictText(s.verdict)}`;
    })
    .join(' · ');
}

export interface VehicleDrawerProps {
  open: boolean;
  onToggle: () => void;
  evaluation: VehicleEvaluation | null;
  selected: VehiclePlacement | undefined;
  children: ReactNode;
}

/** The open drawer's share of the window's height. */
const OPEN_SHARE = 0.6;

export function VehicleDrawer(p: VehicleDrawerProps) {
  return (
    <DrawerFrame
      openShare={p.open ? OPEN_SHARE : null}
      title={p.selected ? `Mirror ${p.selected.label}` : 'Fields and verdicts'}
      numbers={fieldsSummary(p.evaluation)}
      numbersLines={3}
      caution={`Planning only: type approval and local rules decide. ${SHORT_CAUTION}`}
      testIds={VEHICLE_DRAWER_IDS}
      buttons={<DrawerButton testID="vehicle-drawer-toggle" label={p.open ? 'Less' : 'Details'} expanded={p.open} onPress={p.onToggle} />}
    >
      {p.children}
    </DrawerFrame>
  );
}

const VEHICLE_DRAWER_IDS = {
  drawer: 'vehicle-drawer',
  title: 'vehicle-drawer-title',
  numbers: 'vehicle-drawer-numbers',
  caution: 'vehicle-drawer-caution',
  body: 'vehicle-drawer-body',
};
