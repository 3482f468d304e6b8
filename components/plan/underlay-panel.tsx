/**
 * The customer's plan under the drawing, in the plan's details: upload it (image or PDF, with a
 * page), see its scale, calibrate, set how strongly it shows, turn and shift it to the grid, replace
 * or remove it. Every change is an underlay edit handed to the workspace, which records it in the
 * plan's undo history and saves the scene. A reviewer sees the plan and its scale only.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented, TextField } from '@/components/ui';
import { UploadControl } from '@/components/uploads/upload-control';
import { palette, radii, spacing } from '@/constants/theme';
import type { FileDto, Underlay } from '@/shared/schemas/files';
import { formatLength, type UnitSystem } from '@/shared/units';
import {
  calibrationPointsM,
  millimetresPerPixel,
  newUnderlay,
  NUDGE_M,
  NUDGE_RAD,
  shiftUnderlay,
  squareToGrid,
  turnUnderlayTo,
  UNCALIBRATED_WIDTH_M,
  UNDERLAY_OPACITIES,
} from './underlay-edits';

export interface UnderlayPanelProps {
  projectId: number;
  canEdit: boolean;
  underlay: Underlay | undefined;
  /** The stored plan image (from the job's files), once known. */
  file: FileDto | undefined;
  units: UnitSystem;
  calibrating: boolean;
  /** A placement, scale or look change: recorded and saved. */
  onChange: (next: Underlay) => void;
  /** A newly uploaded plan replaces any before it. */
  onUploaded: (file: FileDto) => void;
  onCalibrate: () => void;
  onRemove: () => void;
}

/** Whether the underlay still has the width guessed at upload (no two points tapped yet). */
export function isUncalibrated(u: Underlay, file: Pick<FileDto, 'widthPx'> | undefined): boolean {
  const c = u.calibration;
  return (
    c.aPx[0] === 0 &&
    c.aPx[1] === 0 &&
    c.bPx[1] === 0 &&
    file !== undefined &&
    c.bPx[0] === file.widthPx &&
    c.distanceM === UNCALIBRATED_WIDTH_M
  );
}

const OPACITY_WORDS: Record<(typeof UNDERLAY_OPACITIES)[number], string> = { 0.25: 'Faint', 0.5: 'Half', 0.75: 'Strong', 1: 'Full' };
const degrees = (rad: number) => (rad * 180) / Math.PI;

export function UnderlayPanel(p: UnderlayPanelProps) {
  const [pageText, setPageText] = useState('');
  const [confirmRemove, setConfirmRemove] = useState(false);
  const page = /^\s*\d+\s*$/.test(pageText) ? Number(pageText) : null;
  const pageError = pageText.trim() !== '' && (page === null || page < 1) ? 'The page is a whole number from 1.' : undefined;

  const upload = (label: string) => (
    <View style={styles.block}>
      <TextField
        name="underlayPage"
        label="Page of a PDF plan"
        hint="Leave empty for the first page."
        testID="underlay-page"
        value={pageText}
        onChangeText={setPageText}
        inputMode="numeric"
        error={pageError}
      />
      <UploadControl
        projectId={p.projectId}
        kind="plan"
        page={page}
        testID="underlay-upload"
        chooseLabel={label}
        onUploaded={p.onUploaded}
        disabled={Boolean(pageError)}
      />
    </View>
  );

  const u = p.underlay;
  if (!u) {
    if (!p.canEdit) return null;
    return (
      <View style={styles.root} testID="underlay-panel">
        <AppText variant="small" tone="muted">
          Upload the customer’s floor plan (a PNG or JPEG, a phone photo of the paper plan, or a PDF) to draw walls and zones over it.
        </AppText>
        {upload('Upload a plan')}
      </View>
    );
  }

  const uncalibrated = isUncalibrated(u, p.file);
  const pivot = calibrationPointsM(u).aM;
  const change = (next: Underlay) => p.onChange(next);
  const nudge = formatLength(NUDGE_M, p.units);
  const source = p.file
    ? `${p.file.name}${p.file.sourcePage && p.file.sourcePages ? `, page ${p.file.sourcePage} of ${p.file.sourcePages}` : ''}`
    : 'The plan image';

  return (
    <View style={styles.root} testID="underlay-panel">
      <AppText variant="bodyStrong" testID="underlay-name">
        {source}
      </AppText>
      {uncalibrated ? (
        <AppText tone="stop" testID="underlay-scale">
          {`Not calibrated yet: its width is taken as ${formatLength(UNCALIBRATED_WIDTH_M, p.units)}. Calibrate before you draw over it.`}
        </AppText>
      ) : (
        <AppText testID="underlay-scale">
          {`Calibrated: ${formatLength(u.calibration.distanceM, p.units)} between the two points (${millimetresPerPixel(u).toFixed(1)} mm per pixel).`}
        </AppText>
      )}
      {p.canEdit ? (
        <>
          <Button
            label={p.calibrating ? 'Calibrating…' : uncalibrated ? 'Calibrate the scale' : 'Calibrate again'}
            testID="underlay-calibrate"
            variant={uncalibrated ? 'primary' : 'secondary'}
            disabled={p.calibrating}
            onPress={p.onCalibrate}
          />
          <Segmented<string>
            label="How strongly the plan shows"
            value={String(u.opacity)}
            stretch
            onChange={(v) => change({ ...u, opacity: Number(v) })}
            options={UNDERLAY_OPACITIES.map((o) => ({ value: String(o), label: OPACITY_WORDS[o], testID: `underlay-opacity-${o * 100}` }))}
          />
          <View style={styles.block}>
            <AppText variant="label">{`Turn: ${degrees(u.rotationRad).toFixed(1)}°`}</AppText>
            <View style={styles.row}>
              <Button
                label="⟲ Left 0.5°"
                testID="underlay-turn-left"
                variant="secondary"
                onPress={() => change(turnUnderlayTo(u, u.rotationRad + NUDGE_RAD, pivot))}
              />
              <Button
                label="⟳ Right 0.5°"
                testID="underlay-turn-right"
                variant="secondary"
                onPress={() => change(turnUnderlayTo(u, u.rotationRad - NUDGE_RAD, pivot))}
              />
              <Button label="Square to the grid" testID="underlay-square" variant="secondary" onPress={() => change(squareToGrid(u))} />
            </View>
            <AppText variant="small" tone="muted">
              Turns about the first calibration point. “Square to the grid” lays the calibrated line along the nearest grid line.
            </AppText>
          </View>
          <View style={styles.block}>
            <AppText variant="label">{`Move the plan by ${nudge}`}</AppText>
            <View style={styles.row}>
              {(
                [
                  ['west', '← West', -NUDGE_M, 0],
                  ['north', '↑ North', 0, NUDGE_M],
                  ['south', '↓ South', 0, -NUDGE_M],
                  ['east', '→ East', NUDGE_M, 0],
                ] as const
              ).map(([dir, words, dx, dy]) => (
                <Button
                  key={dir}
                  label={words}
                  testID={`underlay-move-${dir}`}
                  variant="secondary"
                  onPress={() => change(shiftUnderlay(u, dx, dy))}
                />
              ))}
            </View>
          </View>
          <AppText variant="small" tone="muted">
            Every turn and move can be undone like a drawing change. Walls, zones and mirrors never move with the plan.
          </AppText>
          {upload('Replace the plan')}
          {confirmRemove ? (
            <View style={styles.confirm} testID="underlay-remove-confirmation">
              <AppText variant="bodyStrong">Remove the plan from this job? What you drew over it stays.</AppText>
              <View style={styles.row}>
                <Button
                  label="Remove plan"
                  variant="danger"
                  testID="underlay-remove-confirm"
                  onPress={() => {
                    setConfirmRemove(false);
                    p.onRemove();
                  }}
                />
                <Button label="Keep it" variant="secondary" testID="underlay-remove-cancel" onPress={() => setConfirmRemove(false)} />
              </View>
            </View>
          ) : (
            <Button label="Remove the plan…" variant="danger" testID="underlay-remove" onPress={() => setConfirmRemove(true)} />
          )}
        </>
      ) : null}
    </View>
  );
}

/** A new plan's underlay, keeping the look of the one it replaces. */
export function underlayForUpload(file: FileDto, previous: Underlay | undefined): Underlay {
  return newUnderlay(file, previous?.opacity ?? 0.5);
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
  block: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'center' },
  confirm: {
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: 2,
    borderColor: palette.stop,
    borderRadius: radii.sm,
    backgroundColor: palette.stopSoft,
  },
});
