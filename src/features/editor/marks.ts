import { create } from 'zustand';

/** What the canvas marks on a step: open comment threads, and how it changed in a comparison. */
export interface StepMark {
  comments?: number;
  change?: 'added' | 'changed';
}

/** Marks shown on the cards; set by the page that opens the editor (a revision and its review). */
export const useStepMarks = create<{ marks: Record<string, StepMark> }>(() => ({ marks: {} }));
