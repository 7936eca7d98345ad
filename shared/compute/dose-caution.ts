/**
 * The standing caution every dose answer carries (API and screen show this one text), with versions so a logged dose
 * records exactly which caution and which engine were shown. Bump a version whenever its text or rules change.
 */
export const DOSE_CAUTION = {
  version: '2026-12-1',
  title: 'A calculation, not medical advice',
  text:
    'This is arithmetic from your own settings. Your ratios, targets and limits must come from your diabetes team. Check ' +
    'your glucose first, treat a low before anything else, and follow your local clinical guidance. If a number looks ' +
    'wrong, do not inject it.',
} as const;

/** Version of the dose engine (shared/compute/dose.ts and active-insulin.ts) that made a suggestion. */
export const DOSE_ENGINE_VERSION = 'dose-engine-2026-12-1';
