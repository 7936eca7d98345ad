import { Link } from 'expo-router';
import { useIsOnline } from '../api/online';
import { useNextPlanMeal } from '../api/plan';
import { doseCheckHref } from '../dose/dose-href';
import { DOSE_NOT_SHOWN_OFFLINE } from '../offline/offline-notice';
import { mealCarbText, plannedDoseText, PLANNED_DOSE_WORDS } from '../plan/plan-format';
import type { CarbUnit } from '../../shared/schemas/units';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

/** The next planned meal not yet logged (from the week plan), offered first; nothing when none is planned. */
export function TodayNextMealCard({ profileId, unit }: { profileId: number; unit: CarbUnit }) {
  const next = useNextPlanMeal(profileId);
  const online = useIsOnline();
  if (next.isPending) return <Card><LoadingState label="Loading the next planned meal…" /></Card>;
  if (next.isError && !next.data) return <Card><ErrorState error={next.error} onRetry={() => void next.refetch()} /></Card>;
  const meal = next.data.meal;
  if (!meal) return null;
  return (
    <Card aria-label="Next planned meal">
      <Text variant="label" color="textMuted">Next planned meal</Text>
      <Text variant="heading">{meal.mealName} · {meal.date} {meal.time}</Text>
      <Text>{meal.title} — {meal.detail}</Text>
      <Text>Carbohydrate: {mealCarbText(meal, unit)}</Text>
      <Text>Planned dose: {online ? plannedDoseText(meal.dose) : DOSE_NOT_SHOWN_OFFLINE}</Text>
      <Text color="textMuted">{PLANNED_DOSE_WORDS}</Text>
      <Link
        href={
          meal.portionCode
            ? doseCheckHref({ code: meal.portionCode, carbGrams: meal.carb.grams, label: meal.title }, true, meal.id)
            : `/dose-check?log=1&plan=${meal.id}${meal.carb.grams != null ? `&carbs=${meal.carb.grams}&label=${encodeURIComponent(meal.title)}` : ''}`
        }
        asChild
      >
        <Button label="Log this meal" />
      </Link>
    </Card>
  );
}
