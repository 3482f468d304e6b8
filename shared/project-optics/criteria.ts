/**
 * Detect and recognise: the two criteria a zone can ask for. The angles are the project's (scene
 * JSON, `criteria`), else the defaults; a zone names which of the two applies to it. Basis of the
 * default angles: docs/sources.md, "Detect and recognise" (engineering judgement, from memory).
 */
import { ARCMIN_RAD } from '../optics';
import { DEFAULT_CRITERIA_RAD, type CriteriaSettings, type CriterionKind, type Scene, type SceneZone } from '../schemas';

export type { CriterionKind, CriteriaSettings };

/** The project's two angles (radians), or the defaults when the project has not set them. */
export function criteriaOf(scene: Pick<Scene, 'criteria'>): CriteriaSettings {
  return scene.criteria ?? { ...DEFAULT_CRITERIA_RAD };
}

/** The criterion a zone asks for; zones saved before criteria existed meant "recognise". */
export function zoneCriterion(zone: Pick<SceneZone, 'criterion'>): CriterionKind {
  return zone.criterion ?? 'recognise';
}

/** The angle (radians) a criterion stands for in this project. */
export function criterionAngleRad(criteria: CriteriaSettings, kind: CriterionKind): number {
  return kind === 'detect' ? criteria.detectRad : criteria.recogniseRad;
}

/** "6′", "20′", "7.5′": an angle in minutes of arc, for the labels that state a criterion. */
export function formatArcmin(rad: number): string {
  if (!Number.isFinite(rad)) return '—';
  const arcmin = Math.round((rad / ARCMIN_RAD) * 10) / 10;
  return `${arcmin}′`;
}

/** "20′ of the person's height": what a criterion asks, in the words the panel and the sheet use. */
export function criterionText(criteria: CriteriaSettings, kind: CriterionKind): string {
  return `${formatArcmin(criterionAngleRad(criteria, kind))} of the person's height`;
}

/** Whether a project's angles are the defaults (the sheet says which). */
export function isDefaultCriteria(criteria: CriteriaSettings): boolean {
  return criteria.detectRad === DEFAULT_CRITERIA_RAD.detectRad && criteria.recogniseRad === DEFAULT_CRITERIA_RAD.recogniseRad;
}

/** The basis of the angles in a few words: engineering judgement, or the project's own choice. */
export function criteriaBasisText(criteria: CriteriaSettings): string {
  return isDefaultCriteria(criteria)
    ? 'engineering judgement, not a published rule'
    : `set for this project (the defaults, ${formatArcmin(DEFAULT_CRITERIA_RAD.detectRad)} and ${formatArcmin(DEFAULT_CRITERIA_RAD.recogniseRad)}, are engineering judgement, not a published rule)`;
}

/** One sentence stating both angles and their basis, for the panel and the sheet. */
export function criteriaSentence(criteria: CriteriaSettings): string {
  return `Detect: the person's height spans at least ${formatArcmin(criteria.detectRad)} at the eye through the mirror; recognise: at least ${formatArcmin(criteria.recogniseRad)}; ${criteriaBasisText(criteria)}.`;
}
