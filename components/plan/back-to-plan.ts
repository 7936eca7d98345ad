import { router } from 'expo-router';

/** After saving, back to the plan screen underneath (a fresh one only when this page was opened directly). */
export function backToPlan(): void {
  if (router.canGoBack()) router.back();
  else router.replace('/plan');
}
