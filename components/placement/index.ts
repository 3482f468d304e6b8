export { PlacementEditor, type PlacementEditorProps } from './placement-editor';
export { PlacementConflictNotice, valuesText } from './placement-conflict';
export { PlacementNumbersPanel, rimSqueezeText, type PlacementNumbersPanelProps } from './numbers-panel';
export { ElevationView } from './elevation-view';
export { MirrorPicker } from './mirror-picker';
export { catalogueLine, mirrorSizeText, radiusText, priceText, SHAPE_LABELS, PORTION_LABELS } from './mirror-text';
export { useDisplayUnits } from './use-display-units';
