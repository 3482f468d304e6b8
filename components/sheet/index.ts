export { SheetActions, revisionText, sheetEmailSchema, type SheetActionsProps } from './sheet-actions';
