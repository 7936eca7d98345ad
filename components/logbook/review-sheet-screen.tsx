import { StyleSheet, View } from 'react-native';
import { formatGlucose, glucoseToMmol } from '../../shared/compute/units';
import { RATIO_REVIEW_CAUTION, type LogReview } from '../../shared/schemas/logbook-read';
import { useActiveProfile } from '../api/auth';
import { useLogCharts, useRatioReview } from '../api/logbook';
import { canPrint, printPage, usePrintStyles } from '../kitchen/print';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { LazyLogChartsPanel } from './log-charts-lazy';
import { unitsText } from './log-format';
import { ReviewTable } from './review-table';
import { usePeriodParam } from './review-screen';

const hideInPrint = { dataSet: { print: 'hide' } } as object;
const keepTogether = { dataSet: { print: 'label' } } as object;

function DayKinds({ review }: { review: LogReview }) {
  const t = useTheme();
  return (
    <Card {...keepTogether}>
      <Text variant="heading">Day kinds and times of day in force</Text>
      {review.dayKinds.map((k) => (
        <View key={k.id} style={[styles.kind, { borderColor: t.colors.border }]}>
          <Text weight="bold">
            {k.name}
            {k.isDefault ? ' (default)' : ''} · long-acting planned: {unitsText(k.longActingUnits)}
          </Text>
          {k.timesOfDay.map((b) => (
            <Text key={b.from}>
              {b.from}–{b.to}: 1 unit per {b.carbRatio} g · correction 1 unit per {formatGlucose(glucoseToMmol(b.correctionFactor, review.glucoseUnit), review.glucoseUnit)}
            </Text>
          ))}
        </View>
      ))}
    </Card>
  );
}

/** The review sheet for a clinic appointment: the period's charts, the ratio review and the day kinds, on A4. */
export function ReviewSheetScreen() {
  usePrintStyles();
  const { profile } = useActiveProfile();
  const period = usePeriodParam();
  const charts = useLogCharts(profile?.id, period);
  const review = useRatioReview(profile?.id, period);
  const failed = charts.isError ? charts : review.isError ? review : null;
  return (
    <Screen title={`Review sheet${profile ? ` · ${profile.displayName}` : ''}`} subtitle={`${period.from} to ${period.to}`} backHref="/logbook">
      <View {...hideInPrint}>{canPrint ? <Button label="Print" onPress={printPage} /> : null}</View>
      <Callout tone="caution">{RATIO_REVIEW_CAUTION}</Callout>
      {failed ? (
        <ErrorState error={failed.error} onRetry={() => void failed.refetch()} />
      ) : !charts.data || !review.data ? (
        <LoadingState />
      ) : (
        <>
          <LazyLogChartsPanel data={charts.data} />
          <Card {...keepTogether}>
            <Text variant="heading">Ratio review</Text>
            <ReviewTable review={review.data} carbUnit={profile?.carbUnit ?? 'g'} />
            <Text color="textMuted">
              {review.data.mealsUsed} of {review.data.mealsInPeriod} meals had a reading before and 2–4 h after with nothing in between. Figures from
              fewer than {review.data.minimumMeals} meals are marked too few.
            </Text>
          </Card>
          <DayKinds review={review.data} />
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({ kind: { borderTopWidth: 1, paddingTop: 6, gap: 2 } });
