/**
 * Ranks the catalogue for the question after the thumb rests (a short debounce): one ranking
 * takes up to ~150 ms on a phone, too long to run on every keystroke. `busy` is true meanwhile.
 */
import { useEffect, useState } from 'react';
import { OpticsInputError } from '@/shared/optics';
import { rankQuick, type QuickOption, type QuickQuestion } from '@/shared/quick';
import type { CatalogueItemDto } from '@/shared/schemas';

export const QUICK_DEBOUNCE_MS = 250;

export interface QuickRanking {
  options: QuickOption[];
  /** The question the options answer (the sketch must draw that one, not one typed since). */
  answered: QuickQuestion | null;
  busy: boolean;
  problem: string | null;
}

export function useQuickRanking(question: QuickQuestion | null, catalogue: readonly CatalogueItemDto[] | undefined): QuickRanking {
  const [state, setState] = useState<Omit<QuickRanking, 'busy'>>({ options: [], answered: null, problem: null });
  useEffect(() => {
    if (!question || !catalogue) return;
    const timer = setTimeout(() => {
      try {
        const options = rankQuick(question, catalogue);
        setState({
          options,
          answered: question,
          problem: options.length ? null : 'No catalogue mirror sees any of this area from there; try another place or height.',
        });
      } catch (e) {
        const problem = e instanceof OpticsInputError ? e.message : 'These values cannot be answered; check the measurements.';
        setState({ options: [], answered: question, problem });
      }
    }, QUICK_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [question, catalogue]);
  // Busy from the moment the question differs from the one answered, so the old answer is never mistaken for the new.
  return { ...state, busy: question !== null && catalogue !== undefined && state.answered !== question };
}
