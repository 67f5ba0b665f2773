/**
 * Optional capabilities wired into the screen: the planner, the spread analysis and export. Each one
 * is absent until its module is part of the build; the key table then shows why the key is off.
 */
import type { Services } from './services';

/** The capability services available in this build. */
export function capabilities(): Pick<Services, 'plan' | 'spread' | 'exportDesign'> {
  return {};
}
