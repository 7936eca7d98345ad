import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { addDaysIso } from '../../shared/compute/plan';
import { useActiveProfile, useProfileCan } from '../api/auth';
import { useDeletePlanMeal, usePlanWeek } from '../api/plan';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { PlanDayCard } from './plan-day';
import { dayText } from '../ui/date-format';
import { PLANNED_DOSE_WORDS, totalsText } from './plan-format';
import { PlanWarnings } from './plan-warnings';

/** The week plan: warnings first, then the days (one at a time on a phone, seven columns on a wide screen) and the week's totals. */
export function PlanScreen() {
  const { profile } = useActiveProfile();
  const [date, setDate] = useState<string | undefined>(undefined);
  const [dayIndex, setDayIndex] = useState<number | null>(null);
  const week = usePlanWeek(profile?.id, date);
  const remove = useDeletePlanMeal(profile?.id);
  const { isWide } = useLayout();
  // A clinician reads the plan: no buttons the server would refuse.
  const canWrite = useProfileCan('plan.write');

  if (!profile || week.isPending) return <Screen title="Plan"><LoadingState label="Loading the week…" /></Screen>;
  if (week.isError) return <Screen title="Plan"><ErrorState error={week.error} onRetry={() => void week.refetch()} /></Screen>;

  const w = week.data;
  const todayIndex = w.days.findIndex((d) => d.date === w.today);
  const index = dayIndex ?? (todayIndex >= 0 ? todayIndex : 0);
  const day = w.days[index];
  const totals = totalsText(w.totals, w.unit);
  const step = (by: number) => {
    setDate(addDaysIso(w.weekStart, by * 7));
    setDayIndex(0);
  };
  const onRemove = canWrite ? (id: number) => remove.mutate(id) : undefined;

  return (
    <Screen title="Plan" subtitle={`Week of ${dayText(w.days[0].date)}`}>
      <View style={styles.row}>
        <Button variant="secondary" label="‹ Week before" onPress={() => step(-1)} />
        <Button variant="secondary" label="Week after ›" onPress={() => step(1)} />
      </View>
      <View style={styles.row}>
        {canWrite ? (
          <>
            <Link href={{ pathname: '/plan/meal', params: { date: day.date } }} asChild>
              <Button label="Plan a meal" />
            </Link>
            <Link href={{ pathname: '/plan/cook', params: { date: day.date } }} asChild>
              <Button variant="secondary" label="Plan a cook" />
            </Link>
            <Link href="/plan/settings" asChild>
              <Button variant="secondary" label="Weekly pattern and meals" />
            </Link>
          </>
        ) : null}
        <Link href={{ pathname: '/plan/shopping', params: { date: w.weekStart } }} asChild>
          <Button variant="secondary" label="Shopping list" />
        </Link>
        <Link href={{ pathname: '/plan/print', params: { date: w.weekStart } }} asChild>
          <Button variant="secondary" label="Print the week" />
        </Link>
      </View>
      <PlanWarnings warnings={w.warnings} />
      <Callout tone="caution" title={PLANNED_DOSE_WORDS}>
        Each planned dose is the carbohydrate ÷ the insulin-to-carb ratio of that day’s kind for the meal’s time, rounded to
        your pen step. Before you eat, check your glucose and work out the dose with the dose check; follow your diabetes team.
      </Callout>
      {!w.doseReady ? <Callout tone="caution" title="No planned doses yet">Set up your units and safety limits and your kinds of day to see planned doses.</Callout> : null}
      {isWide ? (
        <View style={styles.columns} aria-label="The week">
          {w.days.map((d) => <PlanDayCard key={d.date} day={d} unit={w.unit} compact onRemove={onRemove} />)}
        </View>
      ) : (
        <View style={styles.stack}>
          <View style={styles.row}>
            <Button variant="quiet" label="‹ Day before" disabled={index === 0} onPress={() => setDayIndex(index - 1)} />
            <Button variant="quiet" label="Day after ›" disabled={index === 6} onPress={() => setDayIndex(index + 1)} />
          </View>
          <PlanDayCard day={day} unit={w.unit} onRemove={onRemove} />
        </View>
      )}
      <Card aria-label="Week totals">
        <Text variant="heading">The week</Text>
        <Text>Carbohydrate {totals.carb}</Text>
        <Text>Planned rapid-acting {totals.rapid}</Text>
        <Text>Long-acting {totals.long}</Text>
        {w.use.map((u) => (
          <Text key={`${u.batchId}-${u.plannedCookId}`}>
            {u.title}: {u.placed} of {u.holds} portions placed, {u.left} left{u.plannedCookId ? ' (planned cook)' : ''}
          </Text>
        ))}
        {w.cooks.map((c) => (
          <Text key={c.id}>
            To cook: {c.recipeTitle}, {c.portions} portions, {c.cookOn ?? 'no date yet'}
            {c.batchId ? ' (cooked)' : ''}
          </Text>
        ))}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  stack: { gap: 8 },
  columns: { flexDirection: 'row', gap: 8, alignItems: 'flex-start' },
});
