import { Line } from '../common/line';
import type { Question } from '../state/app-state';
import type { Theme } from '../theme';

/** Props of QuestionLine. */
export interface QuestionLineProps {
  question: Question;
  /** The current time (ms since the epoch), for the draft's age. */
  now: number;
  width: number;
  theme: Theme;
}

function age(savedAt: number, now: number): string {
  const s = Math.max(0, Math.round((now - savedAt) / 1000));
  if (s < 90) return `${s} s`;
  if (s < 5400) return `${Math.round(s / 60)} min`;
  return `${Math.round(s / 3600)} h`;
}

/** A one-key question in place of the message line; the hint bar below lists the answers. */
export function QuestionLine({ question, now, width, theme }: QuestionLineProps) {
  const text = question.kind === 'quit'
    ? 'Unsaved changes. Save before quitting?'
    : question.kind === 'export'
      ? 'Export as which format? (keys below; the file name comes next)'
      : `Found unsaved edits from ${age(question.draft.savedAt, now)} ago (the last session did not save). Restore them?`;
  return <Line width={width} segs={[{ text, style: theme.modified() }]} />;
}
