import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/number-field';
import { Segmented } from '@/components/ui/segmented';
import { TextField } from '@/components/ui/text-field';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import type { CatalogueItemDto, MirrorSpec } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { catalogueLine, compareMirrorsBySize, SHAPE_LABELS, SHAPE_ORDER } from './mirror-text';

export type MirrorChoice = { catalogueItemId: number; customMirror: null } | { catalogueItemId: null; customMirror: MirrorSpec };

export interface MirrorPickerProps {
  catalogue: readonly CatalogueItemDto[];
  value: MirrorChoice;
  onChange: (choice: MirrorChoice) => void;
  units: UnitSystem;
  /** Server or engine sentences about the custom mirror's fields, keyed like "customMirror.radiusM". */
  errors?: Record<string, string>;
}

/** A sensible starting custom mirror: a common 600 mm round panel on an 800 mm sphere. */
const DEFAULT_CUSTOM: Record<MirrorSpec['shape'], MirrorSpec> = {
  round: { shape: 'round', diameterM: 0.6, radiusM: 0.8 },
  rect: { shape: 'rect', widthM: 0.6, heightM: 0.4, radiusM: 0.8 },
  dome: { shape: 'dome', portion: 'half', diameterM: 0.8 },
};

function matches(item: CatalogueItemDto, q: string): boolean {
  if (!q) return true;
  const hay = `${item.code} ${item.name} ${SHAPE_LABELS[item.mirror.shape]}`.toLowerCase();
  return q
    .toLowerCase()
    .split(/\s+/)
    .every((word) => hay.includes(word));
}

/** Choose a catalogue mirror (searchable, grouped by shape) or describe a custom one. */
export function MirrorPicker({ catalogue, value, onChange, units, errors = {} }: MirrorPickerProps) {
  const [mode, setMode] = useState<'catalogue' | 'custom'>(value.customMirror ? 'custom' : 'catalogue');
  const [q, setQ] = useState('');
  const active = useMemo(
    () => catalogue.filter((c) => c.active || c.id === value.catalogueItemId).sort(compareMirrorsBySize),
    [catalogue, value.catalogueItemId],
  );
  const groups = SHAPE_ORDER.map((shape) => ({
    shape,
    items: active.filter((c) => c.mirror.shape === shape && matches(c, q.trim())),
  })).filter((g) => g.items.length > 0);
  const custom = value.customMirror;

  return (
    <View style={styles.box}>
      <Segmented
        label="Mirror source"
        stretch
        value={mode}
        onChange={(m) => {
          setMode(m);
          if (m === 'custom' && !value.customMirror) {
            // Start from the catalogue mirror in use, so switching keeps the size the person had.
            const from = catalogue.find((c) => c.id === value.catalogueItemId)?.mirror ?? DEFAULT_CUSTOM.round;
            onChange({ catalogueItemId: null, customMirror: from });
          }
        }}
        options={[
          { value: 'catalogue', label: 'From catalogue', testID: 'placement-mirror-source-catalogue' },
          { value: 'custom', label: 'Custom', testID: 'placement-mirror-source-custom' },
        ]}
      />
      {mode === 'catalogue' ? (
        <View style={styles.box}>
          <TextField
            name="placement-catalogue-search"
            label="Find a mirror"
            testID="placement-catalogue-search"
            value={q}
            onChangeText={setQ}
            placeholder="Code, name or shape"
            autoCapitalize="none"
          />
          {groups.length === 0 ? <AppText tone="muted">No catalogue mirror matches “{q}”.</AppText> : null}
          {groups.map((g) => (
            <View key={g.shape} style={styles.group}>
              <AppText variant="caps" tone="muted">
                {SHAPE_LABELS[g.shape]}
              </AppText>
              {g.items.map((item) => (
                <CatalogueOption
                  key={item.id}
                  item={item}
                  units={units}
                  selected={value.catalogueItemId === item.id}
                  onPress={() => onChange({ catalogueItemId: item.id, customMirror: null })}
                />
              ))}
            </View>
          ))}
          {errors.catalogueItemId ? (
            <AppText tone="stop" testID="field-error-catalogueItemId">
              {errors.catalogueItemId}
            </AppText>
          ) : null}
        </View>
      ) : custom ? (
        <CustomMirror
          spec={custom}
          units={units}
          errors={errors}
          onChange={(spec) => onChange({ catalogueItemId: null, customMirror: spec })}
        />
      ) : (
        <Button
          label="Describe a custom mirror"
          testID="placement-custom-start"
          variant="secondary"
          onPress={() => onChange({ catalogueItemId: null, customMirror: DEFAULT_CUSTOM.round })}
        />
      )}
    </View>
  );
}

function CatalogueOption({
  item,
  units,
  selected,
  onPress,
}: {
  item: CatalogueItemDto;
  units: UnitSystem;
  selected: boolean;
  onPress: () => void;
}) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={`placement-catalogue-item-${item.id}`}
      role="radio"
      aria-checked={selected}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered }) => [
        styles.option,
        hovered && !selected && styles.optionHover,
        selected && styles.optionSelected,
        focusVisible && focusRing,
      ]}
    >
      <View style={styles.optionHead}>
        <AppText variant="bodyStrong" style={styles.flex}>
          {item.name}
        </AppText>
        <AppText variant="mono" tone="muted">
          {item.code}
        </AppText>
      </View>
      <AppText variant="small">{catalogueLine(item, units)}</AppText>
      {selected ? (
        <AppText variant="caps" tone="go">
          In use
        </AppText>
      ) : null}
    </Pressable>
  );
}

/** A new shape that keeps the size already typed where the two shapes share a measure. */
export function reshape(spec: MirrorSpec, shape: MirrorSpec['shape']): MirrorSpec {
  if (shape === spec.shape) return spec;
  const across = spec.shape === 'rect' ? spec.widthM : spec.diameterM;
  // A dome has no separate radius; 800 mm is a common panel curvature to start from.
  const radiusM = spec.shape === 'dome' ? 0.8 : spec.radiusM;
  if (shape === 'round') return { shape, diameterM: across, radiusM };
  if (shape === 'rect') return { shape, widthM: across, heightM: Math.min(across, 0.4), radiusM };
  return { shape, portion: 'half', diameterM: Math.max(across, 0.1) };
}

function CustomMirror({
  spec,
  units,
  errors,
  onChange,
}: {
  spec: MirrorSpec;
  units: UnitSystem;
  errors: Record<string, string>;
  onChange: (s: MirrorSpec) => void;
}) {
  const err = (f: string) => errors[`customMirror.${f}`];
  return (
    <View style={styles.box}>
      <Segmented
        label="Shape"
        stretch
        value={spec.shape}
        onChange={(shape) => onChange(reshape(spec, shape))}
        options={SHAPE_ORDER.map((s) => ({ value: s, label: SHAPE_LABELS[s], testID: `placement-custom-shape-${s}` }))}
      />
      {spec.shape === 'dome' ? (
        <Segmented
          label="Dome portion"
          stretch
          value={spec.portion}
          onChange={(portion) => onChange({ ...spec, portion })}
          options={[
            { value: 'full', label: 'Full', testID: 'placement-custom-portion-full' },
            { value: 'half', label: 'Half', testID: 'placement-custom-portion-half' },
            { value: 'quarter', label: 'Quarter', testID: 'placement-custom-portion-quarter' },
          ]}
        />
      ) : null}
      {spec.shape === 'rect' ? (
        <View style={styles.pair}>
          <View style={styles.flex}>
            <NumberField
              name="customMirror.widthM"
              label="Width"
              testID="placement-custom-width"
              units={units}
              kind="size"
              value={spec.widthM}
              error={err('widthM')}
              onChangeValue={(v) => v !== null && onChange({ ...spec, widthM: v })}
            />
          </View>
          <View style={styles.flex}>
            <NumberField
              name="customMirror.heightM"
              label="Height"
              testID="placement-custom-height"
              units={units}
              kind="size"
              value={spec.heightM}
              error={err('heightM')}
              onChangeValue={(v) => v !== null && onChange({ ...spec, heightM: v })}
            />
          </View>
        </View>
      ) : (
        <NumberField
          name="customMirror.diameterM"
          label="Diameter"
          testID="placement-custom-diameter"
          units={units}
          kind="size"
          value={spec.diameterM}
          error={err('diameterM')}
          onChangeValue={(v) => v !== null && onChange({ ...spec, diameterM: v })}
        />
      )}
      {spec.shape !== 'dome' ? (
        <NumberField
          name="customMirror.radiusM"
          label="Radius of curvature"
          testID="placement-custom-radius"
          units={units}
          kind="size"
          value={spec.radiusM}
          error={err('radiusM')}
          onChangeValue={(v) => v !== null && onChange({ ...spec, radiusM: v })}
        />
      ) : (
        <AppText variant="small" tone="muted">
          A dome is part of a sphere whose radius of curvature is half its diameter.
        </AppText>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.md },
  group: { gap: spacing.sm },
  pair: { flexDirection: 'row', gap: spacing.md },
  flex: { flex: 1 },
  option: {
    minHeight: layout.minTarget,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.ruleSoft,
    backgroundColor: palette.card,
    gap: spacing.xxs,
  },
  optionHover: { borderColor: palette.rule },
  optionSelected: { borderColor: palette.go, backgroundColor: palette.goSoft },
  optionHead: { flexDirection: 'row', gap: spacing.sm, alignItems: 'baseline' },
});
