import { useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { logPeriodQuerySchema, RATIO_REVIEW_CAUTION, type LogPeriodQuery } from '../../shared/schemas/logbook-read';
import { useActiveProfile } from '../api/auth';
import { useRatioReview } from '../api/logbook';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { defaultPeriod } from './log-format';
import { PeriodForm } from './period-form';
import { ReviewTable } from './review-table';

/** The period from the address (?from=&to=) when it is a valid one, else the last 14 days. */
export function usePeriodParam(): LogPeriodQuery {
  const params = useLocalSearchParams<{ from?: string; to?: string }>();
  const parsed = logPeriodQuerySchema.safeParse({ from: params.from, to: params.to });
  return parsed.success ? parsed.data : defaultPeriod();
}

/** The ratio review: what happened after meals, per day kind and time of day. It never proposes a ratio. */
export function ReviewScreen() {
  const { profile } = useActiveProfile();
  const [period, setPeriod] = useState(usePeriodParam());
  const review = useRatioReview(profile?.id, period);
  return (
    <Screen title="Ratio review" subtitle="The evidence from your logbook, for a talk with your diabetes team." backHref="/logbook">
      <Callout tone="caution" title="This does not change your ratios">
        {RATIO_REVIEW_CAUTION}
      </Callout>
      <PeriodForm values={period} onApply={setPeriod} />
      {review.isPending ? (
        <LoadingState />
      ) : review.isError ? (
        <ErrorState error={review.error} onRetry={() => void review.refetch()} />
      ) : (
        <Card>
          <Text>
            Meals with a reading up to an hour before and a reading 2 to 4 hours after, and no other meal or rapid-acting dose in
            between. A figure needs at least {review.data.minimumMeals} meals before it says much; fewer are marked “too few”.
          </Text>
          <ReviewTable review={review.data} carbUnit={profile?.carbUnit ?? 'g'} />
          <Text color="textMuted" style={styles.counts}>
            {review.data.mealsUsed} of {review.data.mealsInPeriod} meals used. Left out: {review.data.skipped.noReadingBefore} without a
            reading before, {review.data.skipped.noReadingAfter} without a reading 2–4 h after, {review.data.skipped.somethingBetween} with
            another meal or dose in between.
          </Text>
        </Card>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({ counts: { marginTop: 4 } });
