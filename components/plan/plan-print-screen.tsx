import { StyleSheet, View } from 'react-native';
import { useActiveProfile } from '../api/auth';
import { usePlanWeek } from '../api/plan';
import { canPrint, printPage, usePrintStyles } from '../kitchen/print';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { PlanDayCard } from './plan-day';
import { dayText } from '../ui/date-format';
import { PLANNED_DOSE_WORDS, totalsText } from './plan-format';
import { PlanWarnings } from './plan-warnings';

const hideInPrint = { dataSet: { print: 'hide' } } as object;
const keepTogether = { dataSet: { print: 'label' } } as object;

/** The week on A4: kinds of day, meals with carbohydrate and planned doses, totals and the batches to cook. */
export function PlanPrintScreen({ date }: { date: string }) {
  const { profile } = useActiveProfile();
  const week = usePlanWeek(profile?.id, date);
  usePrintStyles();
  if (!profile || week.isPending) return <Screen title="The week to print" backHref="/plan"><LoadingState /></Screen>;
  if (week.isError) return <Screen title="The week to print" backHref="/plan"><ErrorState error={week.error} onRetry={() => void week.refetch()} /></Screen>;
  const w = week.data;
  const totals = totalsText(w.totals, w.unit);
  return (
    <Screen title={`Week of ${dayText(w.days[0].date)}`} subtitle={`${profile.displayName} · ${PLANNED_DOSE_WORDS}`} backHref="/plan">
      <View {...hideInPrint} style={styles.row}>{canPrint ? <Button label="Print" onPress={printPage} /> : null}</View>
      <PlanWarnings warnings={w.warnings} />
      <View style={styles.grid}>
        {w.days.map((d) => (
          <View key={d.date} {...keepTogether} style={styles.cell}>
            <PlanDayCard day={d} unit={w.unit} />
          </View>
        ))}
      </View>
      <View {...keepTogether}>
        <Text variant="heading">Batches to cook</Text>
        {w.cooks.length ? w.cooks.map((c) => <Text key={c.id}>{c.recipeTitle}: {c.portions} portions, {c.cookOn ?? 'no date yet'}{c.batchId ? ' (cooked)' : ''}</Text>) : <Text>None planned.</Text>}
        <Text>Week: carbohydrate {totals.carb}; planned rapid-acting {totals.rapid}; long-acting {totals.long}.</Text>
        <Text color="textMuted">A calculation from your own settings, not medical advice. Check glucose before every dose and follow your diabetes team.</Text>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: 8 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  cell: { flexBasis: 300, flexGrow: 1 },
});
